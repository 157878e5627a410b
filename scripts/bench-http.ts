/**
 * `npm run bench:http`: the built app beside two yardsticks (a bare node:http page and a node:http + pg
 * keyset list on the same database), each loaded in short interleaved slices with autocannon, the order
 * reversed every other round. Prints per scenario the medians over rounds of req/s, p50, p99 and CPU per
 * request (server process, and PostgreSQL's backends), and the median of per-round ratios to the keyset
 * list. Absolute figures swing on a shared machine; the ratios are what to compare.
 *
 * Options: --rounds N (5), --seconds S per slice (3), --connections C (50), --per-address N (10: each
 * simulated client sends N requests in a row from its own address; 1 makes every request a first visit,
 * which costs the API's rate limit one database write each), --only REGEX (scenario names;
 * the keyset baseline always runs), --profile (the app runs under `node --cpu-prof`; a summary follows),
 * --search (`npm run bench:search`: adds 10 000 open commissions and 1 000 workrooms around Merrowgate,
 * waits for the index, then loads the near-me page and the search API beside a node:http + pg baseline
 * running the same near-me keyset query), --fresh (app requests carry `Cache-Control: no-cache`, so signed-in
 * pages and lists are rendered every time instead of sent again from memory while nothing has changed).
 */
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { startBenchEnvironment, signIn, stopChild, waitForAnswer } from './bench/environment';
import { slice, type Slice } from './bench/load';
import { summariseProfile } from './bench/profile';
import {
	baselineName,
	demoAccounts,
	scenarios,
	searchBaselineName,
	searchScenarios,
	type Scenario,
	type Target
} from './bench/scenarios';
import { seedSearchData, waitForIndex } from './bench/search-data';
import { median, table } from './bench/stats';
import { freePort, log, root, runCleanups } from './lib/local';

const { values: options } = parseArgs({
	options: {
		rounds: { type: 'string', default: '5' },
		seconds: { type: 'string', default: '3' },
		connections: { type: 'string', default: '50' },
		only: { type: 'string' },
		'per-address': { type: 'string', default: '10' },
		profile: { type: 'boolean', default: false },
		search: { type: 'boolean', default: false },
		fresh: { type: 'boolean', default: false }
	}
});
const rounds = Number(options.rounds);
const seconds = Number(options.seconds);
const connections = Number(options.connections);
const requestsPerAddress = Number(options['per-address']);
const scenarioList = options.search ? searchScenarios : scenarios;
const yardstick = options.search ? searchBaselineName : baselineName;

function startBaseline(kind: 'bare' | 'keyset' | 'nearby', port: number, databaseUrl: string) {
	return spawn(
		process.execPath,
		['--import', 'tsx', 'scripts/bench/baseline-server.ts', kind, String(port), databaseUrl],
		{
			cwd: root,
			stdio: ['ignore', 'ignore', 'inherit']
		}
	);
}

type Run = {
	scenario: Scenario;
	url: string;
	headers: Record<string, string>;
	body?: string;
	bodyFor?: (n: number) => string;
	slices: Slice[];
};

/** The search stand-in in its own process (see scripts/bench/search-standin.ts). */
async function startSearchProcess() {
	const port = await freePort();
	const masterKey = randomBytes(16).toString('hex');
	const child = spawn(
		process.execPath,
		['--import', 'tsx', 'scripts/bench/search-standin.ts', String(port), masterKey],
		{ cwd: root, stdio: ['ignore', 'ignore', 'inherit'] }
	);
	cleanups.push(() => stopChild(child));
	const host = `http://127.0.0.1:${port}`;
	await waitForAnswer(`${host}/health`);
	return { MEILI_HOST: host, MEILI_MASTER_KEY: masterKey };
}

async function main(profileDir: string | null) {
	const environment = await startBenchEnvironment({
		nodeArgs: profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : [],
		env: options.search ? await startSearchProcess() : {}
	});
	cleanups.push(environment.stop);
	const { app, appUrl, databaseUrl, postmasterPid } = environment;
	if (options.search) {
		log('adding 10 000 open commissions and 1 000 workrooms, and waiting for the index…');
		await seedSearchData(databaseUrl);
		await waitForIndex(databaseUrl);
	}
	const ports = { bare: await freePort(), keyset: await freePort(), nearby: await freePort() };
	const bare = startBaseline('bare', ports.bare, databaseUrl);
	cleanups.unshift(() => stopChild(bare));
	const keyset = startBaseline('keyset', ports.keyset, databaseUrl);
	cleanups.unshift(() => stopChild(keyset));
	await waitForAnswer(`http://127.0.0.1:${ports.bare}/`);
	const nearby = startBaseline('nearby', ports.nearby, databaseUrl);
	cleanups.unshift(() => stopChild(nearby));
	await waitForAnswer(`http://127.0.0.1:${ports.keyset}/`);
	await waitForAnswer(`http://127.0.0.1:${ports.nearby}/`);
	const pids: Record<Target, number> = { app: app.pid!, bare: bare.pid!, keyset: keyset.pid!, nearby: nearby.pid! };

	const cookies = {
		customer: await signIn(appUrl, demoAccounts.customer),
		tailor: await signIn(appUrl, demoAccounts.tailor)
	};
	const only = options.only ? new RegExp(options.only, 'i') : null;
	const runs: Run[] = [];
	for (const scenario of scenarioList) {
		if (only && scenario.name !== yardstick && !only.test(scenario.name)) continue;
		const base = scenario.target === 'app' ? appUrl : `http://127.0.0.1:${ports[scenario.target]}`;
		const headers: Record<string, string> = { origin: base, accept: 'text/html,application/json' };
		if (scenario.as) headers.cookie = cookies[scenario.as];
		// --fresh: every app request asks for a new answer, as after a change (no answer sent again from memory).
		if (options.fresh && scenario.target === 'app') headers['cache-control'] = 'no-cache';
		if (scenario.body !== undefined) headers['content-type'] = 'application/json';
		const run: Run = { scenario, url: base + scenario.path, headers, slices: [] };
		if (scenario.body !== undefined) run.body = JSON.stringify(scenario.body);
		const { bodyFor } = scenario;
		if (bodyFor) run.bodyFor = (n) => JSON.stringify(bodyFor(n));
		const probe = await fetch(run.url, {
			method: scenario.method ?? 'GET',
			headers,
			body: run.body,
			redirect: 'manual'
		});
		await probe.arrayBuffer();
		const source = probe.headers.get('x-search-source');
		if (source) log(`"${scenario.name}" answers from the ${source === 'index' ? 'search index' : source}`);
		if (probe.status === 404 && scenario.optional) {
			log(`skipping "${scenario.name}": ${scenario.path} answers 404`);
			continue;
		}
		if (probe.status !== (scenario.status ?? 200)) log(`warning: "${scenario.name}" answers ${probe.status}`);
		runs.push(run);
	}

	const load = (run: Run, secondsPerSlice: number) =>
		slice({
			url: run.url,
			method: run.scenario.method ?? 'GET',
			headers: run.headers,
			body: run.body,
			bodyFor: run.bodyFor,
			requestsPerAddress,
			connections,
			seconds: secondsPerSlice,
			serverPid: pids[run.scenario.target],
			postmasterPid,
			status: run.scenario.status ?? 200
		});

	log(`warming up ${runs.length} scenarios…`);
	for (const run of runs) await load(run, 1);
	for (let round = 0; round < rounds; round++) {
		log(`round ${round + 1} of ${rounds}`);
		const order = round % 2 ? [...runs].reverse() : runs;
		for (const run of order) run.slices.push(await load(run, seconds));
	}

	report(runs);
	// Requests cut off by the last slice may still be running in the app: let them end before it stops.
	await new Promise((r) => setTimeout(r, 3000));
	if (profileDir) {
		await stopChild(app, 30_000);
		for (const file of readdirSync(profileDir))
			console.log(`\nCPU profile of the app (${file}):\n${summariseProfile(join(profileDir, file))}`);
	}
}

function report(runs: Run[]) {
	const baseline = runs.find((r) => r.scenario.name === yardstick)!;
	const figure = (value: number, digits = 0) => (Number.isFinite(value) ? value.toFixed(digits) : '—');
	const rows = [['scenario', 'req/s', 'p50 ms', 'p99 ms', 'server µs/req', 'db µs/req', '× keyset', 'failed']];
	for (const run of runs) {
		const ratios = run.slices.map((s, round) => s.requestsPerSecond / baseline.slices[round].requestsPerSecond);
		const failures = run.slices.reduce((sum, s) => sum + s.failures, 0);
		const requests = run.slices.reduce((sum, s) => sum + s.requests, 0);
		rows.push([
			run.scenario.name,
			figure(median(run.slices.map((s) => s.requestsPerSecond))),
			figure(median(run.slices.map((s) => s.p50))),
			figure(median(run.slices.map((s) => s.p99))),
			figure(median(run.slices.map((s) => s.serverCpuMicrosPerRequest))),
			figure(median(run.slices.map((s) => s.databaseCpuMicrosPerRequest))),
			figure(median(ratios), 2),
			failures ? `${((100 * failures) / Math.max(1, requests)).toFixed(0)} %` : '0'
		]);
	}
	console.log(
		`\nTackline HTTP bench — ${rounds} rounds of ${seconds} s slices, ${connections} connections, Node ${process.version}\n` +
			`(medians over rounds; "× keyset" is the median of per-round req/s ratios to "${yardstick}")\n`
	);
	console.log(table(rows));
	const odd = runs.filter((r) => r.slices.some((s) => s.failures));
	for (const run of odd) {
		const codes: Record<string, number> = {};
		for (const s of run.slices)
			for (const [code, n] of Object.entries(s.statusCodes)) codes[code] = (codes[code] ?? 0) + n;
		console.log(`  ${run.scenario.name}: status codes ${JSON.stringify(codes)}`);
	}
}

const cleanups: (() => unknown)[] = [];
let failed = false;
try {
	const profileDir = options.profile ? mkdtempSync(join(tmpdir(), 'tackline-profile-')) : null;
	if (profileDir) cleanups.push(() => rmSync(profileDir, { recursive: true, force: true }));
	await main(profileDir);
} catch (error) {
	failed = true;
	console.error(error);
} finally {
	await runCleanups(cleanups);
}
process.exit(failed ? 1 : 0);
