/**
 * What both benches stand on: a throwaway PostgreSQL cluster with the demo seed, the mail stand-ins, the
 * production build, and the app on a free port; `stop()` takes it all down again.
 */
import type { ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { chmodSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startStandins } from '../../docker/standins';
import { demoPassword } from '../demo/people';
import {
	buildIfNeeded,
	freePort,
	migrateAndSeed,
	runCleanups,
	startDatabase,
	startServer,
	waitForHealth
} from '../lib/local';

function exited(child: ChildProcess, timeoutMs: number) {
	if (child.exitCode !== null || child.signalCode !== null) return Promise.resolve();
	return new Promise<void>((resolve) => {
		const timer = setTimeout(resolve, timeoutMs);
		child.once('exit', () => {
			clearTimeout(timer);
			resolve();
		});
	});
}

export async function stopChild(child: ChildProcess, timeoutMs = 10_000) {
	child.kill('SIGTERM');
	await exited(child, timeoutMs);
	if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
}

export async function waitForAnswer(url: string, timeoutMs = 30_000) {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		try {
			if ((await fetch(url)).ok) return;
		} catch {
			// not listening yet
		}
		await new Promise((r) => setTimeout(r, 200));
	}
	throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
}

/** Signs a demo account in through the password form and answers its cookie header. */
export async function signIn(baseUrl: string, email: string) {
	const response = await fetch(`${baseUrl}/sign-in?/password`, {
		method: 'POST',
		headers: { origin: baseUrl, 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': '198.19.0.1' },
		body: new URLSearchParams({ email, password: demoPassword }),
		redirect: 'manual'
	});
	const cookie = response.headers
		.getSetCookie()
		.map((header) => header.split(';')[0])
		.filter((pair) => !pair.endsWith('='))
		.join('; ');
	if (!cookie.includes('session-token')) throw new Error(`signing in ${email} failed (${response.status})`);
	return cookie;
}

/** `nodeArgs` go before `build` (e.g. `--cpu-prof`); `env` overrides the stand-ins' settings for the app. */
export async function startBenchEnvironment(options: { nodeArgs?: string[]; env?: Record<string, string> } = {}) {
	const work = mkdtempSync(join(tmpdir(), 'tackline-bench-'));
	chmodSync(work, 0o755); // the postgres user must be able to enter it
	const cleanups: (() => unknown)[] = [() => rmSync(work, { recursive: true, force: true })];
	const stop = () => runCleanups(cleanups);
	try {
		const database = await startDatabase({
			dataDir: join(work, 'pg', 'data'),
			port: await freePort(),
			user: 'tackline',
			password: randomBytes(16).toString('hex'),
			database: 'tackline_bench',
			throwaway: true
		});
		cleanups.unshift(() => database.stop());
		await migrateAndSeed(database.url, { seed: true });
		const postmasterPid = Number(readFileSync(join(work, 'pg', 'data', 'postmaster.pid'), 'utf8').split('\n')[0]);
		const standins = await startStandins({ smtp: await freePort(), mailApi: await freePort() });
		cleanups.unshift(() => standins.stop());
		await buildIfNeeded({ devTools: false });

		const port = await freePort();
		const appUrl = `http://localhost:${port}`;
		const app = startServer(
			{
				...standins.env,
				...options.env,
				DATABASE_URL: database.url,
				AUTH_SECRET: randomBytes(32).toString('base64url'),
				AUTH_TRUST_HOST: 'true',
				ORIGIN: appUrl,
				PORT: String(port),
				HOST: '127.0.0.1',
				ADDRESS_HEADER: 'x-forwarded-for'
			},
			process.execPath,
			[...(options.nodeArgs ?? []), 'build']
		);
		cleanups.unshift(() => stopChild(app, 30_000));
		await waitForHealth(appUrl);
		return { work, databaseUrl: database.url, postmasterPid, app, appUrl, cleanups, stop };
	} catch (error) {
		await stop();
		throw error;
	}
}
