// Module resolution hooks that let scripts run the app's domain code outside SvelteKit: `$lib/…`
// points into src/lib, and the few Kit modules domain code touches get plain stand-ins.
const shims = {
	'$env/dynamic/private': './env-dynamic-private.mjs',
	'$app/server': './app-server.mjs',
	'$app/environment': './app-environment.mjs'
};

export async function resolve(specifier, context, next) {
	if (specifier in shims) return { url: new URL(shims[specifier], import.meta.url).href, shortCircuit: true };
	if (specifier.startsWith('$lib/')) {
		return next(new URL(`../../../src/lib/${specifier.slice(5)}.ts`, import.meta.url).href, context);
	}
	return next(specifier, context);
}
