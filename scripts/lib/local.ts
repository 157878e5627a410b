/** Shared set-up for `npm start`, `npm run dev` and `npm test`: database, migrations, stand-ins, build. */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { join, resolve } from 'node:path';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import {
	databaseUrl,
	ensurePostgresInstalled,
	initCluster,
	startCluster,
	stopCluster,
	type Cluster
} from '../../docker/postgres/cluster';
import { createDb } from '../../src/lib/server/db/client';

export const root = resolve(import.meta.dirname, '../..');

export function log(line: string) {
	console.log(`[tackline] ${line}`);
}

/** A value kept in `.data/` across runs, created once. */
export function persistentSecret(dir: string, name: string) {
	const file = join(dir, name);
	if (existsSync(file)) return readFileSync(file, 'utf8').trim();
	mkdirSync(dir, { recursive: true });
	const value = randomBytes(32).toString('base64url');
	writeFileSync(file, value + '\n', { mode: 0o600 });
	return value;
}

export function freePort(): Promise<number> {
	return new Promise((resolvePort, reject) => {
		const server = createServer();
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			const address = server.address();
			server.close(() => resolvePort(typeof address === 'object' && address ? address.port : 0));
		});
	});
}

export async function startDatabase(cluster: Cluster) {
	const bin = ensurePostgresInstalled(log);
	if (initCluster(bin, cluster)) log(`Created PostgreSQL cluster in ${cluster.dataDir}`);
	await startCluster(bin, cluster);
	const url = databaseUrl(cluster);
	log(`PostgreSQL is up on 127.0.0.1:${cluster.port}`);
	return { url, stop: () => stopCluster(bin, cluster) };
}

export async function migrateAndSeed(url: string, options: { seed: boolean }) {
	const { db, pool } = createDb(url, { max: 2 });
	try {
		const started = performance.now();
		await migrate(db, { migrationsFolder: join(root, 'drizzle') });
		log(`Migrations applied (${Math.round(performance.now() - started)} ms)`);
		if (options.seed) {
			// The seed takes its demo orders through the app's own functions, whose job queue reads DATABASE_URL;
			// it is put back afterwards, so nothing started later inherits this database by accident.
			const previous = process.env.DATABASE_URL;
			process.env.DATABASE_URL = url;
			try {
				const { seedDemo } = await import('../demo/seed-demo');
				const result = await seedDemo(db);
				log(result === 'already-seeded' ? 'Demo data already present' : 'Demo data seeded');
			} finally {
				if (previous === undefined) delete process.env.DATABASE_URL;
				else process.env.DATABASE_URL = previous;
			}
		}
	} finally {
		await pool.end();
	}
}

function newestMtime(path: string): number {
	if (!existsSync(path)) return 0;
	const stat = statSync(path);
	if (!stat.isDirectory()) return stat.mtimeMs;
	return readdirSync(path).reduce((max, entry) => Math.max(max, newestMtime(join(path, entry))), stat.mtimeMs);
}

const buildInputs = [
	'src',
	'server',
	'static',
	'svelte.config.js',
	'vite.config.ts',
	'tailwind.config.js',
	'package-lock.json'
];

/**
 * Builds the server unless `build/` is newer than every input and of the same flavour. `devTools`
 * compiles in the development inbox (tests and local demos); a plain `npm start` build leaves it out.
 */
export async function buildIfNeeded(options: { force?: boolean; devTools: boolean }) {
	const stamp = join(root, 'build', '.tackline-built');
	const flavour = options.devTools ? 'with development tools' : 'production';
	const newestInput = Math.max(...buildInputs.map((p) => newestMtime(join(root, p))));
	const upToDate =
		existsSync(stamp) && statSync(stamp).mtimeMs > newestInput && readFileSync(stamp, 'utf8').startsWith(flavour);
	if (!options.force && upToDate) {
		log('Build is up to date');
		return;
	}
	log(`Building Tackline (${flavour})…`);
	await runCommand(join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], {
		TACKLINE_DEV_TOOLS: options.devTools ? '1' : '0'
	});
	writeFileSync(stamp, `${flavour}\n${new Date().toISOString()}\n`);
}

export function runCommand(command: string, args: string[], env: Record<string, string> = {}) {
	return new Promise<number>((resolveRun, reject) => {
		const child = spawn(command, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
		child.once('error', reject);
		child.once('exit', (code) => (code === 0 ? resolveRun(0) : reject(new Error(`${command} exited with ${code}`))));
	});
}

/** adapter-node's cap on any request body: one 15 MB photo upload with its multipart framing. */
export const uploadBodySizeLimit = '16M';

export function startServer(env: Record<string, string>, command = 'node', args = ['build']): ChildProcess {
	return spawn(command, args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
}

export async function waitForHealth(baseUrl: string, timeoutMs = 60_000) {
	const deadline = Date.now() + timeoutMs;
	while (Date.now() < deadline) {
		try {
			const response = await fetch(`${baseUrl}/api/v1/health`);
			if (response.status === 200) return;
		} catch {
			// not listening yet
		}
		await new Promise((r) => setTimeout(r, 250));
	}
	throw new Error(`Tackline did not become healthy at ${baseUrl} within ${timeoutMs / 1000} s`);
}

/** Asks a child to stop and waits (up to five seconds) until it has. */
export async function stopProcess(child: ChildProcess) {
	if (child.exitCode !== null || child.signalCode !== null) return;
	const exited = new Promise((resolveExit) => child.once('exit', resolveExit));
	child.kill('SIGTERM');
	await Promise.race([exited, new Promise((resolveWait) => setTimeout(resolveWait, 5000))]);
}

/** Runs each clean-up in turn, reporting (not throwing) a failing one so the rest still run. */
export async function runCleanups(cleanups: (() => unknown)[]) {
	for (const cleanup of cleanups) {
		try {
			await cleanup();
		} catch (error) {
			console.error('cleanup failed:', error);
		}
	}
}
