import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { signIn, startBenchEnvironment, stopChild, waitForAnswer } from './bench/environment';
import { seedSearchData, waitForIndex } from './bench/search-data';
import { freePort, root } from './lib/local';
const port = await freePort();
const masterKey = randomBytes(16).toString('hex');
const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/bench/search-standin.ts', String(port), masterKey], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
await waitForAnswer(`http://127.0.0.1:${port}/health`);
const env = await startBenchEnvironment({ env: { MEILI_HOST: `http://127.0.0.1:${port}`, MEILI_MASTER_KEY: masterKey } });
try {
	await seedSearchData(env.databaseUrl);
	await waitForIndex(env.databaseUrl);
	const cookie = await signIn(env.appUrl, 'tailor@tackline.test');
	for (const path of ['/workroom/commissions', '/workroom/commissions', '/workroom/commissions', '/api/v1/commissions']) {
		const t = performance.now();
		const r = await fetch(env.appUrl + path, { headers: { cookie }, redirect: 'manual' });
		const body = await r.text();
		console.log(path, r.status, body.length, Math.round(performance.now() - t), 'ms', [...r.headers].filter(([k]) => /age|cookie|etag|cache|keep|search/.test(k)));
	}
} finally {
	await env.stop();
	await stopChild(child);
}
