/**
 * The two yardsticks `npm run bench:http` measures Tackline against, each in its own process so its CPU
 * can be read apart: `bare` answers a fixed 2 KB page from node:http; `keyset` answers the first 20
 * open commissions from PostgreSQL (keyset order on an index, no count) through a pg pool the size of
 * the app's. Usage: node --import tsx scripts/bench/baseline-server.ts bare|keyset PORT [DATABASE_URL]
 */
import http from 'node:http';
import pg from 'pg';

const [kind, portText, databaseUrl] = process.argv.slice(2);

const page = Buffer.from(
	`<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Bench</title></head><body><main>${'<p>Merrowgate tailors at work.</p>'.repeat(56)}</main></body></html>`
);

function bare(_req: http.IncomingMessage, res: http.ServerResponse) {
	res.writeHead(200, { 'content-type': 'text/html; charset=utf-8', 'content-length': page.length }).end(page);
}

function keyset(pool: pg.Pool) {
	const query = {
		name: 'bench-keyset',
		text: `select id, title, garment_type, city, district, budget_min_minor, budget_max_minor, currency, published_at
		       from commission
		       where status = 'open' and (published_at, id) < ($1, $2)
		       order by published_at desc, id desc
		       limit 20`
	};
	return (_req: http.IncomingMessage, res: http.ServerResponse) => {
		pool
			.query({ ...query, values: ['infinity', 'ffffffff-ffff-ffff-ffff-ffffffffffff'] })
			.then(({ rows }) => {
				const body = JSON.stringify({ items: rows });
				res.writeHead(200, { 'content-type': 'application/json' }).end(body);
			})
			.catch((error: Error) => {
				res.writeHead(500).end(error.message);
			});
	};
}

const handler =
	kind === 'bare' ? bare : kind === 'keyset' ? keyset(new pg.Pool({ connectionString: databaseUrl, max: 10 })) : null;
if (!handler) throw new Error(`unknown baseline "${kind}" (bare or keyset)`);

http.createServer(handler).listen(Number(portText), '127.0.0.1', () => console.log(`${kind} baseline ready`));
process.on('SIGTERM', () => process.exit(0));
