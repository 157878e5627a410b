import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

// Development tools (the local mail inbox) are compiled in only when the build is made for a
// machine running the local stand-ins; production images build without TACKLINE_DEV_TOOLS.
const devTools = process.env.TACKLINE_DEV_TOOLS === '1' || process.env.NODE_ENV === 'development';

/** Files that stop or slow the shared mail stand-in: they run alone, after the others. */
const serialIntegrationFiles = [
	'tests/integration/mail-queue.spec.ts',
	'tests/integration/notification-mail.spec.ts',
	'tests/integration/health.spec.ts'
];

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
					exclude: serialIntegrationFiles,
					// Each file gets its own database copy, server and stand-ins (tests/integration/setup.ts), so
					// files run side by side; most of their time is spent waiting, not computing.
					setupFiles: ['tests/integration/setup.ts'],
					maxWorkers: 3,
					testTimeout: 30_000,
					hookTimeout: 60_000
				}
			},
			{
				extends: './vite.config.ts',
				test: {
					name: 'integration-serial',
					environment: 'node',
					include: serialIntegrationFiles,
					setupFiles: ['tests/integration/setup.ts'],
					fileParallelism: false,
					testTimeout: 30_000,
					hookTimeout: 60_000
				}
			}
		]
	}
});
