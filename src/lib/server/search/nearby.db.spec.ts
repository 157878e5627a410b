import { sql, type SQL } from 'drizzle-orm';
import { Meilisearch } from 'meilisearch';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sphericalDistanceKm } from '$lib/geo/distance';
import { createUser } from '../../../../tests/factories';
import * as commissions from '../commissions';
import { createDb } from '../db/client';
import * as workrooms from '../workrooms';
import { decodeCursor } from './cursor';
import { nearbyCommissions, nearbyWorkrooms } from './nearby';

// Kit's env module is fixed when vitest starts; nothing here reaches a configured service.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env } }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

/** A region away from the demo city, filled densely enough that the planner prefers an index to a scan. */
const region = { lat: 52, lng: 13, spanLat: 1.6, spanLng: 2.4 };
const centre = { lat: region.lat + 0.8, lng: region.lng + 1.2 };
const commissionCount = 6000;
const workroomCount = 1500;

/** A search engine that is not there: every list comes from PostgreSQL. */
const unreachable = () => new Meilisearch({ host: 'http://127.0.0.1:9', timeout: 500 });

beforeAll(async () => {
	const customer = await createUser(db);
	// Deterministic spread: a low-discrepancy sequence over the region, garments and budgets in turn.
	await db.execute(sql`
		insert into commission (customer_id, garment_type, title, style_notes, currency, budget_min_minor, budget_max_minor,
			date_needed, approx_lat, approx_lng, city, status, published_at, expires_at)
		select ${customer.id}, (array['straight-skirt','tunic','shift-dress'])[1 + i % 3], 'Spread commission ' || i,
			case when i % 7 = 0 then 'linen, lined' else 'wool' end, 'EUR', 5000 + (i % 10) * 1000, 9000 + (i % 10) * 1000,
			current_date + 30 + i % 60,
			${region.lat} + ((i * 0.6180339887) - floor(i * 0.6180339887)) * ${region.spanLat},
			${region.lng} + ((i * 0.7548776662) - floor(i * 0.7548776662)) * ${region.spanLng},
			'Spreadton', case when i % 10 = 0 then 'cancelled'::commission_status else 'open'::commission_status end,
			now() - (i || ' minutes')::interval, now() + interval '30 days'
		from generate_series(1, ${commissionCount}) as i`);
	await db.execute(sql`
		with made as (
			insert into "user" (email, name, role)
			select 'spread-tailor-' || i || '-' || ${customer.id} || '@example.test', 'Tailor ' || i, 'tailor'
			from generate_series(1, ${workroomCount}) as i
			returning id, split_part(email, '-', 3)::int as i
		)
		insert into tailor_profile (user_id, shop_name, slug, bio, specialties, city, lat, lng, onboarded_at)
		select id, 'Spread workroom ' || i, 'spread-' || i || '-' || left(id::text, 8), 'Alterations and made to measure',
			case when i % 2 = 0 then array['tunic'] else array['straight-skirt'] end, 'Spreadton',
			${region.lat} + ((i * 0.6180339887) - floor(i * 0.6180339887)) * ${region.spanLat},
			${region.lng} + ((i * 0.7548776662) - floor(i * 0.7548776662)) * ${region.spanLng}, now()
		from made`);
	await db.execute(sql`analyze commission`);
	await db.execute(sql`analyze tailor_profile`);
	await db.execute(sql`analyze "user"`);
}, 60_000);

type PlanNode = { 'Node Type': string; 'Relation Name'?: string; 'Index Name'?: string; Plans?: PlanNode[] };

async function plan(query: SQL) {
	const result = await db.execute(sql`explain (format json) ${query}`);
	const [{ Plan }] = (result.rows[0] as { 'QUERY PLAN': { Plan: PlanNode }[] })['QUERY PLAN'];
	const nodes: PlanNode[] = [];
	const walk = (node: PlanNode) => {
		nodes.push(node);
		node.Plans?.forEach(walk);
	};
	walk(Plan);
	return nodes;
}

const scansOf = (nodes: PlanNode[], table: string) =>
	nodes.filter((node) => node['Relation Name'] === table).map((node) => node['Node Type']);

describe('the PostgreSQL fallback of the near-me lists', () => {
	const commissionSearches: [string, commissions.searchDocuments.NearbySearch][] = [
		['by distance', { near: centre, radiusKm: 10, filters: {}, sort: 'distance', limit: 21 }],
		['newest first', { near: centre, radiusKm: 10, filters: {}, sort: 'newest', limit: 21 }],
		[
			'with every filter',
			{
				near: centre,
				radiusKm: 25,
				filters: {
					garment: 'tunic',
					budgetMin: 9000,
					budgetMax: 12000,
					dateNeededBefore: '2099-01-01',
					fabricSource: 'tailor_sources',
					q: 'linen'
				},
				sort: 'distance',
				limit: 21
			}
		],
		[
			'on a later page',
			{
				near: centre,
				radiusKm: 10,
				filters: {},
				sort: 'distance',
				after: { distanceM: 2500, id: '00000000-0000-4000-8000-000000000000' },
				limit: 21
			}
		]
	];

	it.each(commissionSearches)(
		'finds open commissions %s through an index, never a full scan',
		async (_name, search) => {
			const nodes = await plan(commissions.searchDocuments.nearbyQuery(search));
			const scans = scansOf(nodes, 'commission');
			expect(scans.length).toBeGreaterThan(0);
			expect(scans).not.toContain('Seq Scan');
			expect(scans.every((type) => /Index|Bitmap Heap/.test(type))).toBe(true);
		}
	);

	it.each([
		['by distance', {}],
		['making a garment, with words', { specialty: 'tunic' as const, q: 'measure' }]
	])('finds workrooms %s through an index, never a full scan', async (_name, filters) => {
		const nodes = await plan(workrooms.searchDocuments.nearbyQuery({ near: centre, radiusKm: 15, filters, limit: 21 }));
		const scans = scansOf(nodes, 'tailor_profile');
		expect(scans.length).toBeGreaterThan(0);
		expect(scans).not.toContain('Seq Scan');
	});

	it('lists exactly the open commissions within the radius, nearest first, ties by id, across pages', async () => {
		const all = await db.execute(sql`
			select id, approx_lat as lat, approx_lng as lng from commission
			where status = 'open' and city = 'Spreadton'`);
		const expected = (all.rows as { id: string; lat: number; lng: number }[])
			.map((row) => ({ id: row.id, metres: sphericalDistanceKm(centre, row) * 1000 }))
			.filter((row) => row.metres <= 10_000)
			.sort((a, b) => Math.round(a.metres) - Math.round(b.metres) || (a.id < b.id ? -1 : 1))
			.map((row) => row.id);
		expect(expected.length).toBeGreaterThan(40);

		const seen: string[] = [];
		let cursor: Parameters<typeof nearbyCommissions>[1]['after'] = null;
		for (let page = 0; page < 50; page += 1) {
			const list = await nearbyCommissions(
				db,
				{ near: centre, radiusKm: 10, filters: {}, sort: 'distance', after: cursor, limit: 15 },
				unreachable
			);
			expect(list.source).toBe('database');
			seen.push(...list.items.map((item) => item.id));
			if (!list.nextCursor) break;
			cursor = decodeCursor(list.nextCursor);
		}
		expect(seen).toEqual(expected);
	});

	it('lists workrooms making a garment nearest first, with whether they serve that spot', async () => {
		const list = await nearbyWorkrooms(
			db,
			{ near: centre, radiusKm: 8, filters: { specialty: 'tunic' }, limit: 50 },
			unreachable
		);
		expect(list.source).toBe('database');
		expect(list.items.length).toBeGreaterThan(3);
		for (const item of list.items) expect(item.specialties).toContain('tunic');
		const distances = list.items.map((item) => item.distanceKm);
		expect(distances).toEqual([...distances].sort((a, b) => a - b));
		expect(list.items.every((item) => item.servesYou === item.distanceKm <= item.serviceRadiusKm + 0.05)).toBe(true);
	});
});
