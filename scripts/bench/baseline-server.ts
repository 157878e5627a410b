/**
 * The two yardsticks `npm run bench:http` measures Tackline against, each in its own process so its CPU
 * can be read apart: `bare` answers a fixed 2 KB page from node:http; `keyset` answers the first 20
 * open commissions from PostgreSQL (keyset order on an index, no count) through a pg pool the size of
 * the app's; `nearby` answers the near-me keyset query the same way (the search bench's yardstick).
 * Usage: node --import tsx scripts/bench/baseline-server.ts bare|keyset|nearby PORT [DATABASE_URL]
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

/**
 * The near-me list as the app's PostgreSQL fallback asks it (bounding box on the indexed coarse point, then
 * the exact great-circle distance, keyset order), from the demo tailor's district within 12 km.
 */
function nearby(pool: pg.Pool) {
	const [lat, lng, radiusKm] = [46.8512, 3.2089, 12];
	const dLat = ((radiusKm * 1.01) / 6371.0088) * (180 / Math.PI);
	const dLng = (Math.asin(Math.sin((radiusKm * 1.01) / 6371.0088) / Math.cos((lat * Math.PI) / 180)) * 180) / Math.PI;
	const query = {
		name: 'bench-nearby',
		text: `select s.id, round(s.raw_m)::int as distance_m from (
			select c.id, 2 * 6371008.8 * asin(least(1, sqrt(power(sin(radians(c.approx_lat - $1::float8) / 2), 2)
				+ cos(radians($1::float8)) * cos(radians(c.approx_lat)) * power(sin(radians(c.approx_lng - $2::float8) / 2), 2)))) as raw_m
			from commission c
			where c.status = 'open' and c.approx_lat between $3 and $4 and c.approx_lng between $5 and $6
		) s where s.raw_m <= $7::float8 order by round(s.raw_m)::int, s.id limit 21`
	};
	const values = [lat, lng, lat - dLat, lat + dLat, lng - dLng, lng + dLng, radiusKm * 1000];
	return (_req: http.IncomingMessage, res: http.ServerResponse) => {
		pool
			.query({ ...query, values })
			.then(({ rows }) => {
				res.writeHead(200, { 'content-type': 'application/json' }).end(JSON.stringify({ items: rows }));
			})
			.catch((error: Error) => {
				res.writeHead(500).end(error.message);
			});
	};
}

const pool = () => new pg.Pool({ connectionString: databaseUrl, max: 10 });
const handler = kind === 'bare' ? bare : kind === 'keyset' ? keyset(pool()) : kind === 'nearby' ? nearby(pool()) : null;
if (!handler) throw new Error(`unknown baseline "${kind}" (bare, keyset or nearby)`);

http.createServer(handler).listen(Number(portText), '127.0.0.1', () => console.log(`${kind} baseline ready`));
process.on('SIGTERM', () => process.exit(0));
