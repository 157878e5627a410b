/**
 * Runs before every integration test file (vitest `setupFiles`): the file gets its own copy of the
 * migrated, demo-seeded template database and — unless its name ends in `.db.spec.ts` — its own built
 * server on a free port. DATABASE_URL and TACKLINE_BASE_URL are set before the test file (and `./http`)
 * is imported; both are removed again after the file's last test. Each file's server also gets its own
 * search stand-in, so its indexes hold that file's database and nothing else (`searchStandin()`).
 */
import type { ChildProcess } from 'node:child_process';
import { afterAll, expect } from 'vitest';
import { copyDatabase, dropDatabase } from '../../scripts/lib/databases';
import { freePort, startServer, stopProcess, uploadBodySizeLimit, waitForHealth } from '../../scripts/lib/local';
import { startSearchStandin } from '../../docker/standins/search';
import { setSearchStandin } from './search';

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
	const started = startServer({
		DATABASE_URL: databaseUrl,
		PORT: String(port),
		ORIGIN: baseUrl,
		BODY_SIZE_LIMIT: uploadBodySizeLimit,
		...search.env
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
