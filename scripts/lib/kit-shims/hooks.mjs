// Module resolution hooks that let scripts run the app's domain code outside SvelteKit: `$lib/…`
// points into src/lib (a module, or a folder's index), and the few Kit modules domain code touches get
// plain stand-ins.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const shims = {
	'$env/dynamic/private': './env-dynamic-private.mjs',
	'$app/server': './app-server.mjs',
	'$app/environment': './app-environment.mjs'
};

function libUrl(path) {
	const base = new URL(`../../../src/lib/${path}`, import.meta.url);
	for (const candidate of [`${base.href}.ts`, `${base.href}/index.ts`, base.href]) {
		if (existsSync(fileURLToPath(candidate))) return candidate;
	}
	return `${base.href}.ts`;
}

export async function resolve(specifier, context, next) {
	if (specifier in shims) return { url: new URL(shims[specifier], import.meta.url).href, shortCircuit: true };
	if (specifier.startsWith('$lib/')) return next(libUrl(specifier.slice(5)), context);
	return next(specifier, context);
}
