/**
 * Runs before every integration test file (vitest `setupFiles`): the file gets its own copy of the
 * migrated, demo-seeded template database and — unless its name ends in `.db.spec.ts` — its own built
 * server on a free port. DATABASE_URL and TACKLINE_BASE_URL are set before the test file (and `./http`)
 * is imported; both are removed again after the file's last test. Each file's server also gets its own
 * search stand-in, so its indexes hold that file's database and nothing else (`searchStandin()`), and its
 * own Stripe stand-in, started from the seed's Stripe state and sending webhooks to that server, so faults
 * and balances stay within the file (`stripeStandin()`, `stripeControl()`).
 */
import type { ChildProcess } from 'node:child_process';
import { afterAll, expect } from 'vitest';
import { copyDatabase, dropDatabase } from '../../scripts/lib/databases';
import { freePort, startServer, stopProcess, uploadBodySizeLimit, waitForHealth } from '../../scripts/lib/local';
import { startSearchStandin } from '../../docker/standins/search';
import { startStripeStandin } from '../../docker/standins/stripe';
import { setSearchStandin } from './search';
import { setStripeStandin } from './stripe';

const templateUrl = process.env.TACKLINE_TEMPLATE_DATABASE_URL;
if (!templateUrl)
	throw new Error('TACKLINE_TEMPLATE_DATABASE_URL is not set; run integration tests through `npm test`');

const databaseUrl = await copyDatabase(templateUrl);
process.env.DATABASE_URL = databaseUrl;

let server: ChildProcess | null = null;
const needsServer = !(expect.getState().testPath ?? '').endsWith('.db.spec.ts');
if (needsServer) {
	const port = await freePort();
	const baseUrl = `http://localhost:${port}`;
	process.env.TACKLINE_BASE_URL = baseUrl;
	const search = await startSearchStandin({ port: 0 });
	setSearchStandin(search);
	afterAll(() => search.stop());
	const stripe = await startStripeStandin({
		port: 0,
		secretKey: process.env.STRIPE_SECRET_KEY,
		initialStateFile: process.env.TACKLINE_STRIPE_SEED_STATE,
		webhookRetryBaseMs: 250
	});
	stripe.setWebhookUrl(`${baseUrl}/api/v1/webhooks/stripe`);
	setStripeStandin(stripe);
	afterAll(() => stripe.stop());
	const started = startServer({
		DATABASE_URL: databaseUrl,
		PORT: String(port),
		ORIGIN: baseUrl,
		BODY_SIZE_LIMIT: uploadBodySizeLimit,
		...search.env,
		...stripe.env,
		// Failed calls surface at once; the app's jobs retry them with the same idempotency key.
		STRIPE_MAX_NETWORK_RETRIES: '0'
	});
	server = started;
	await waitForHealth(baseUrl, 30_000).catch(async (error: unknown) => {
		await stopProcess(started);
		await dropDatabase(databaseUrl);
		throw error;
	});
}

afterAll(async () => {
	if (server) await stopProcess(server);
	await dropDatabase(databaseUrl);
});
