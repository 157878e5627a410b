import { defineConfig, devices } from '@playwright/test';
import { chromiumFlags, chromiumPath } from './scripts/lib/chromium';

// The test harness (`npm test`) starts the built server and passes its address.
const baseURL = process.env.TACKLINE_BASE_URL ?? 'http://localhost:3000';

export default defineConfig({
	testDir: 'tests/e2e',
	outputDir: 'test-results',
	timeout: 30_000,
	expect: { timeout: 7_000 },
	workers: 2,
	retries: process.env.CI ? 1 : 0,
	use: {
		baseURL,
		// The test server reads client addresses from this header (see scripts/test.ts).
		extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.1' },
		trace: 'retain-on-failure',
		screenshot: 'only-on-failure'
	},
	projects: [
		{
			name: 'chromium',
			use: {
				...devices['Desktop Chrome'],
				launchOptions: { executablePath: chromiumPath, args: chromiumFlags }
			}
		}
	]
});
