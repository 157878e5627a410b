import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

// Static files ship with .br and .gz beside them; adapter-node picks one by Accept-Encoding.
const nodeAdapter = adapter({ out: 'build', precompress: true });

/**
 * adapter-node with our own entry in place of its build/index.js (server/index.js): the protective headers
 * reach static files too, which adapter-node serves before any hook runs, and public pages (and the answers the
 * app marks `public, max-age`, server/shared-answers.js) are answered from memory to anyone not signed in.
 * @type {import('@sveltejs/kit').Adapter}
 */
const nodeAdapterWithOwnEntry = {
	...nodeAdapter,
	async adapt(builder) {
		await nodeAdapter.adapt(builder);
		builder.rimraf('build/index.js.map');
		builder.copy('server/index.js', 'build/index.js');
		builder.copy('src/lib/server/http/protective-headers.js', 'build/protective-headers.js');
		builder.copy('server/public-pages.js', 'build/public-pages.js');
		builder.copy('server/shared-answers.js', 'build/shared-answers.js');
		builder.copy('server/private-answers.js', 'build/private-answers.js');
		builder.copy('server/capture.js', 'build/capture.js');
		builder.copy('server/front-door.js', 'build/front-door.js');
		builder.copy('server/pure-answers.js', 'build/pure-answers.js');
		// Public pages go where only our entry serves them (to requests without a session); adapter-node
		// finds its prerendered folder empty and hands a signed-in request to SvelteKit instead.
		builder.copy('build/prerendered', 'build/public-pages');
		builder.rimraf('build/prerendered');
		builder.mkdirp('build/prerendered');
	}
};

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		adapter: nodeAdapterWithOwnEntry,
		// Kit adds hashes for its own inline scripts (hashes, not nonces: a signed-in page may be sent again
		// from server/private-answers.js); nothing is loaded from other origins.
		csp: {
			mode: 'hash',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
