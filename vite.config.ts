import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

// Development tools (the local mail inbox) are compiled in only when the build is made for a
// machine running the local stand-ins; production images build without TACKLINE_DEV_TOOLS.
const devTools = process.env.TACKLINE_DEV_TOOLS === '1' || process.env.NODE_ENV === 'development';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	build: { rolldownOptions: { checks: { pluginTimings: false } } },
	define: { __TACKLINE_DEV_TOOLS__: JSON.stringify(devTools) },
	test: {
		expect: { requireAssertions: true },
		projects: [
			{
				extends: './vite.config.ts',
				test: {
					name: 'unit',
					environment: 'node',
					include: ['src/**/*.spec.ts', 'docker/**/*.spec.ts'],
					exclude: ['src/**/*.db.spec.ts']
				}
			},
			{
				extends: './vite.config.ts',
				test: {
					name: 'integration',
					environment: 'node',
					include: ['tests/integration/**/*.spec.ts', 'src/**/*.db.spec.ts'],
					// Each file gets its own database copy and server (tests/integration/setup.ts).
					setupFiles: ['tests/integration/setup.ts'],
					fileParallelism: false,
					testTimeout: 30_000,
					hookTimeout: 60_000
				}
			}
		]
	}
});
