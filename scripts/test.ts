/**
 * `npm test`: every suite on a throwaway PostgreSQL cluster and throwaway ports — type check, lint,
 * architecture rules, unit tests, integration tests (each file on its own copy of a seeded template
 * database, with its own built server) and browser tests in Debian's Chromium.
 * Ends with one line `N passed, N failed` (the totals CI reads) and a non-zero exit on any failure.
 *
 * `npm test -- <paths…>` runs only the named test files or folders (unit, integration and browser alike)
 * and skips the static checks: for focused work, never for CI.
 */
import { execFileSync, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startStandins } from '../docker/standins';
import { copyDatabase, dropDatabase } from './lib/databases';
import {
	buildIfNeeded,
	freePort,
	log,
	migrateAndSeed,
	root,
	runCleanups,
	startDatabase,
	startServer,
	stopProcess,
	uploadBodySizeLimit,
	waitForHealth
} from './lib/local';

type Tally = { suite: string; passed: number; failed: number; note?: string };
const only = process.argv.slice(2).filter((arg) => !arg.startsWith('-'));
const browserOnly = only.filter((path) => path.startsWith('tests/e2e'));
const vitestOnly = only.filter((path) => !path.startsWith('tests/e2e'));
const tallies: Tally[] = [];
const bin = (name: string) => join(root, 'node_modules/.bin', name);
const work = mkdtempSync(join(tmpdir(), 'tackline-test-'));
chmodSync(work, 0o755); // the postgres user must be able to enter it

function ensureChromium() {
	if (existsSync('/usr/bin/chromium')) return;
	if (process.getuid?.() !== 0) throw new Error('Chromium is missing. Run: sudo apt-get install -y chromium');
	log('Installing Chromium from Debian packages (first run only)…');
	execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
	execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], {
		stdio: 'inherit',
		env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
	});
}

function run(command: string, args: string[], env: Record<string, string> = {}) {
	return new Promise<number>((resolve) => {
		const child = spawn(command, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
		child.once('error', () => resolve(1));
		child.once('exit', (code) => resolve(code ?? 1));
	});
}

/** Like `run`, but holds the output back and prints it in one piece when done, for work run beside other work. */
function runHeld(command: string, args: string[]) {
	return new Promise<{ code: number; output: string }>((resolve) => {
		const child = spawn(command, args, { cwd: root, stdio: ['ignore', 'pipe', 'pipe'], env: process.env });
		const chunks: Buffer[] = [];
		child.stdout.on('data', (chunk: Buffer) => chunks.push(chunk));
		child.stderr.on('data', (chunk: Buffer) => chunks.push(chunk));
		child.once('error', () => resolve({ code: 1, output: Buffer.concat(chunks).toString() }));
		child.once('exit', (code) => resolve({ code: code ?? 1, output: Buffer.concat(chunks).toString() }));
	});
}

function readJson<T>(file: string): T | null {
	try {
		return JSON.parse(readFileSync(file, 'utf8')) as T;
	} catch {
		return null;
	}
}

async function vitestSuite(suite: string, project: string, env: Record<string, string>) {
	const out = join(work, `${project}.json`);
	const code = await run(
		bin('vitest'),
		['run', '--project', project, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`].concat(
			only.length ? ['--passWithNoTests', ...vitestOnly] : []
		),
		env
	);
	const report = readJson<{ numPassedTests: number; numFailedTests: number; numTotalTests: number }>(out);
	if (!report) return tallies.push({ suite, passed: 0, failed: 1, note: `vitest exited ${code} without a report` });
	// A crash outside any test (a file that fails to import) still counts as a failure.
	const failed = report.numFailedTests + (code !== 0 && report.numFailedTests === 0 ? 1 : 0);
	tallies.push({ suite, passed: report.numPassedTests, failed });
}

async function playwrightSuite(env: Record<string, string>) {
	const out = join(work, 'playwright.json');
	const code = await run(bin('playwright'), ['test', '--reporter=list,json', ...browserOnly], {
		...env,
		PLAYWRIGHT_JSON_OUTPUT_NAME: out
	});
	const report = readJson<{ stats: { expected: number; unexpected: number; flaky: number } }>(out);
	if (!report)
		return tallies.push({ suite: 'browser', passed: 0, failed: 1, note: `playwright exited ${code} without a report` });
	const failed = report.stats.unexpected + (code !== 0 && report.stats.unexpected === 0 ? 1 : 0);
	tallies.push({ suite: 'browser', passed: report.stats.expected + report.stats.flaky, failed });
}

const cleanups: (() => unknown)[] = [];
async function main() {
	ensureChromium();
	const database = await startDatabase({
		dataDir: join(work, 'pg', 'data'),
		port: await freePort(),
		user: 'tackline',
		password: randomBytes(16).toString('hex'),
		// Never connected to while tests run: each integration file and the browser server get a copy.
		database: 'tackline_template',
		throwaway: true
	});
	cleanups.push(() => database.stop());
	const standins = await startStandins({ smtp: await freePort(), mailApi: await freePort() });
	cleanups.push(() => standins.stop());
	// The seed stores demo photos in the S3 stand-in, shared by every test file.
	Object.assign(process.env, standins.env);
	await migrateAndSeed(database.url, { seed: true });
	// Each integration file's Stripe stand-in starts from what the seed left in the shared one.
	const stripeSeedState = join(work, 'stripe-seed.json');
	standins.stripe.saveState(stripeSeedState);

	const env: Record<string, string> = {
		...standins.env,
		TACKLINE_TEMPLATE_DATABASE_URL: database.url,
		TACKLINE_STRIPE_SEED_STATE: stripeSeedState,
		AUTH_SECRET: randomBytes(32).toString('base64url'),
		AUTH_TRUST_HOST: 'true',
		// Tests present each client as its own address, so per-address sign-in limits stay apart.
		ADDRESS_HEADER: 'x-forwarded-for',
		// Mail gives up after three quick retries, so the dead-letter tests do not wait an hour.
		MAIL_RETRY_LIMIT: '3',
		MAIL_RETRY_DELAY_SECONDS: '1'
	};

	const staticChecks = [
		['type check', 'check'],
		['formatting', 'lint'],
		['lint', 'lint:eslint'],
		['architecture', 'check:architecture']
	];
	// The static checks are single-threaded: on two cores they run beside the unit tests and the build. The
	// type check and lint read SvelteKit's generated types, which the build writes again as it starts: the
	// build waits until they are done.
	let typedChecksDone = () => {};
	const typedChecks = new Promise<void>((resolve) => (typedChecksDone = resolve));
	async function staticLane() {
		for (const [suite, script] of only.length ? [] : staticChecks) {
			const { code, output } = await runHeld('npm', ['run', '--silent', script]);
			process.stdout.write(`[tackline] ${suite}:\n${output}`);
			tallies.push({ suite, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1 });
			if (suite === 'lint') typedChecksDone();
		}
		typedChecksDone();
	}
	async function unitAndBuildLane() {
		if (!only.length || vitestOnly.length) await vitestSuite('unit', 'unit', env);
		await typedChecks;
		await buildIfNeeded({ force: true, devTools: true });
	}
	await Promise.all([staticLane(), unitAndBuildLane()]);

	if (!only.length || vitestOnly.length) {
		await vitestSuite('integration', 'integration', env);
		await vitestSuite('integration, serial', 'integration-serial', env);
	}
	if (only.length && !browserOnly.length) return;

	const browserDatabase = await copyDatabase(database.url, 'browser');
	cleanups.unshift(() => dropDatabase(browserDatabase));
	const port = await freePort();
	const baseUrl = `http://localhost:${port}`;
	const browserEnv = {
		...env,
		DATABASE_URL: browserDatabase,
		ORIGIN: baseUrl,
		PORT: String(port),
		TACKLINE_BASE_URL: baseUrl,
		BODY_SIZE_LIMIT: uploadBodySizeLimit
	};
	standins.stripe.setWebhookUrl(`${baseUrl}/api/v1/webhooks/stripe`);
	const server = startServer(browserEnv);
	cleanups.unshift(() => stopProcess(server));
	await waitForHealth(baseUrl);
	await playwrightSuite(browserEnv);
}

let crashed = false;
try {
	await main();
} catch (error) {
	crashed = true;
	console.error(error);
} finally {
	await runCleanups(cleanups);
	rmSync(work, { recursive: true, force: true });
}

for (const t of tallies) log(`${t.suite}: ${t.passed} passed, ${t.failed} failed${t.note ? ` (${t.note})` : ''}`);
const passed = tallies.reduce((sum, t) => sum + t.passed, 0);
const failed = tallies.reduce((sum, t) => sum + t.failed, 0) + (crashed ? 1 : 0);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
