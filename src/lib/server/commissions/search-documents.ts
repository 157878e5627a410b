import { and, asc, eq, gt, inArray, isNotNull, sql, type SQL } from 'drizzle-orm';
import type { SizeBandRange } from '$lib/format/size-band';
import { boundingBox } from '$lib/geo/distance';
import type { LatLng } from '$lib/geo/coarsen';
import type { Executor } from '../db';
import { preparedPer } from '../db/prepared';
import { commission, commissionPhoto, commissionSizeBand, type FabricSource } from '../db/schema';

/** What the search index holds for an open commission: enough to filter, sort and match text; no measurements. */
export type CommissionSearchDocument = {
	id: string;
	title: string;
	styleNotes: string;
	garment: string;
	fabricSource: FabricSource;
	budgetMinMinor: number | null;
	budgetMaxMinor: number | null;
	currency: string;
	/** Days since 1970-01-01, so "needed by" filters compare numbers. */
	dateNeededDay: number | null;
	publishedAtMs: number;
	_geo: LatLng;
};

export type NearbyCommissionFilters = {
	garment?: string;
	budgetMin?: number;
	budgetMax?: number;
	dateNeededBefore?: string;
	fabricSource?: FabricSource;
	q?: string;
};

export type CommissionSort = 'distance' | 'newest';

/** One listed commission: its distance in whole metres and publication in whole milliseconds, the paging keys. */
export type NearbyHit = { id: string; distanceM: number; publishedMs: number };

/** Where paging resumes: after this key in the list's order. */
export type NearbyAfter = { distanceM: number; id: string } | { publishedMs: number; id: string };

const dayMs = 86_400_000;
export const epochDay = (date: string) => Math.floor(Date.parse(`${date}T00:00:00Z`) / dayMs);

const documentColumns = {
	id: commission.id,
	title: commission.title,
	styleNotes: commission.styleNotes,
	garment: commission.garmentType,
	fabricSource: commission.fabricSource,
	budgetMinMinor: commission.budgetMinMinor,
	budgetMaxMinor: commission.budgetMaxMinor,
	currency: commission.currency,
	dateNeeded: commission.dateNeeded,
	publishedAt: commission.publishedAt,
	lat: commission.approxLat,
	lng: commission.approxLng
};

const listable = and(eq(commission.status, 'open'), isNotNull(commission.approxLat), isNotNull(commission.approxLng));

/** A row as read by `documentColumns`: the document's plain fields, with the date, time and place unconverted. */
type DocumentRow = Omit<CommissionSearchDocument, 'dateNeededDay' | 'publishedAtMs' | '_geo'> & {
	dateNeeded: string | null;
	publishedAt: Date | null;
	lat: number | null;
	lng: number | null;
};

function toDocument({ dateNeeded, publishedAt, lat, lng, ...row }: DocumentRow): CommissionSearchDocument {
	return {
		...row,
		dateNeededDay: dateNeeded === null ? null : epochDay(dateNeeded),
		publishedAtMs: publishedAt?.getTime() ?? 0,
		_geo: { lat: lat!, lng: lng! }
	};
}

/** The documents of those commissions that belong in the index (open, placed); the rest are to be removed. */
export async function searchDocuments(db: Executor, ids: string[]): Promise<CommissionSearchDocument[]> {
	if (ids.length === 0) return [];
	const rows = await db
		.select(documentColumns)
		.from(commission)
		.where(and(listable, inArray(commission.id, ids)));
	return rows.map(toDocument);
}

/** Every listed commission's document in id order, a page at a time, for a full rebuild. */
export async function allSearchDocuments(
	db: Executor,
	{ afterId, limit = 1000 }: { afterId?: string; limit?: number }
): Promise<CommissionSearchDocument[]> {
	const rows = await db
		.select(documentColumns)
		.from(commission)
		.where(and(listable, afterId ? gt(commission.id, afterId) : undefined))
		.orderBy(asc(commission.id))
		.limit(limit);
	return rows.map(toDocument);
}

/**
 * Great-circle metres from `near` on the WGS-84 mean radius, written as the search engine computes
 * `_geoDistance` (haversine, R = 6 371 008.8 m), so both paths agree on distances and order.
 */
function haversineMetresSql(
	latColumn: typeof commission.approxLat,
	lngColumn: typeof commission.approxLng,
	near: LatLng
) {
	return sql<number>`(2 * 6371008.8 * asin(least(1, sqrt(
		power(sin(radians(${latColumn} - ${near.lat}::float8) / 2), 2)
		+ cos(radians(${near.lat}::float8)) * cos(radians(${latColumn})) * power(sin(radians(${lngColumn} - ${near.lng}::float8) / 2), 2)
	))))`;
}

function escapeLike(word: string) {
	return word.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** Each word somewhere in the title or the style notes. */
function textFilter(q: string | undefined): SQL[] {
	const words = (q ?? '').trim().split(/\s+/).filter(Boolean).slice(0, 8);
	return words.map((word) => {
		const pattern = `%${escapeLike(word)}%`;
		return sql`(${commission.title} ilike ${pattern} or ${commission.styleNotes} ilike ${pattern})`;
	});
}

/**
 * Open commissions within `radiusKm` of `near`, straight from PostgreSQL: the list search gives when it is
 * up. A bounding box on the indexed coarse coordinates narrows the rows first (the partial index on open
 * commissions), then the exact distance decides; keyset-paged after `after`.
 */
export async function nearbyFromDatabase(db: Executor, search: NearbySearch): Promise<NearbyHit[]> {
	const result = await db.execute(nearbyQuery(search));
	return (result.rows as { id: string; distanceM: number; publishedMs: string | number }[]).map((row) => ({
		id: row.id,
		distanceM: Number(row.distanceM),
		publishedMs: Number(row.publishedMs)
	}));
}

export type NearbySearch = {
	near: LatLng;
	radiusKm: number;
	filters: NearbyCommissionFilters;
	sort: CommissionSort;
	after?: NearbyAfter | null;
	limit: number;
};

/** The statement behind `nearbyFromDatabase`, apart so that a test can EXPLAIN it. */
export function nearbyQuery({ near, radiusKm, filters, sort, after, limit }: NearbySearch): SQL {
	const box = boundingBox(near, radiusKm);
	const conditions: SQL[] = [
		sql`${commission.status} = 'open'`,
		sql`${commission.approxLat} between ${box.minLat} and ${box.maxLat}`,
		sql`${commission.approxLng} between ${box.minLng} and ${box.maxLng}`
	];
	if (filters.garment) conditions.push(sql`${commission.garmentType} = ${filters.garment}`);
	if (filters.fabricSource) conditions.push(sql`${commission.fabricSource} = ${filters.fabricSource}`);
	if (filters.budgetMin !== undefined) conditions.push(sql`${commission.budgetMaxMinor} >= ${filters.budgetMin}`);
	if (filters.budgetMax !== undefined) conditions.push(sql`${commission.budgetMinMinor} <= ${filters.budgetMax}`);
	if (filters.dateNeededBefore) conditions.push(sql`${commission.dateNeeded} <= ${filters.dateNeededBefore}::date`);
	conditions.push(...textFilter(filters.q));

	const raw = haversineMetresSql(commission.approxLat, commission.approxLng, near);
	const radiusM = radiusKm * 1000;
	let keyset = sql`true`;
	if (after && 'distanceM' in after)
		keyset = sql`(round(s.raw_m)::int, s.id) > (${after.distanceM}::int, ${after.id}::uuid)`;
	if (after && 'publishedMs' in after)
		keyset = sql`(s.published_ms, s.id) < (${after.publishedMs}::bigint, ${after.id}::uuid)`;
	const order = sort === 'distance' ? sql`round(s.raw_m)::int, s.id` : sql`s.published_ms desc, s.id desc`;

	return sql`
		select s.id, round(s.raw_m)::int as "distanceM", s.published_ms as "publishedMs"
		from (
			select ${commission.id} as id, ${raw} as raw_m,
				floor(extract(epoch from ${commission.publishedAt}) * 1000)::bigint as published_ms
			from ${commission}
			where ${sql.join(conditions, sql` and `)}
		) s
		where s.raw_m <= ${radiusM}::float8 and ${keyset}
		order by ${order}
		limit ${limit}`;
}

/** A listed commission as a browsing tailor sees it on a card: never measurements or the customer's name. */
export type CommissionCard = {
	id: string;
	title: string;
	garment: string;
	garmentOther: string;
	sizeBand: SizeBandRange[];
	budget: { minMinor: number; maxMinor: number; currency: string } | null;
	dateNeeded: string | null;
	fabricSource: FabricSource;
	handover: 'pickup' | 'delivery';
	town: string | null;
	district: string | null;
	publishedAt: Date | null;
	photo: { id: string; altText: string } | null;
};

/**
 * The listed commission's id, qualified: in a select from one table Drizzle writes columns bare, and a bare
 * `"id"` inside a subquery would name the subquery's own row.
 */
const listedId = sql`${commission}.${sql.identifier('id')}`;

const bandJson = sql<SizeBandRange[]>`coalesce((
	select json_agg(json_build_object('dimension', b.dimension, 'lowerMm', b.lower_mm, 'upperMm', b.upper_mm) order by b.position)
	from ${commissionSizeBand} b where b.commission_id = ${listedId}
), '[]'::json)`;

const firstPhoto = sql<{ id: string; altText: string } | null>`(
	select json_build_object('id', p.id, 'altText', p.alt_text) from ${commissionPhoto} p
	where p.commission_id = ${listedId} order by p.sort_order, p.created_at limit 1
)`;

const cardsStatement = preparedPer((db) =>
	db
		.select({
			id: commission.id,
			title: commission.title,
			garment: commission.garmentType,
			garmentOther: commission.garmentOther,
			sizeBand: bandJson,
			budgetMinMinor: commission.budgetMinMinor,
			budgetMaxMinor: commission.budgetMaxMinor,
			currency: commission.currency,
			dateNeeded: commission.dateNeeded,
			fabricSource: commission.fabricSource,
			handover: commission.handover,
			town: commission.city,
			district: commission.district,
			publishedAt: commission.publishedAt,
			photo: firstPhoto
		})
		.from(commission)
		.where(and(eq(commission.status, 'open'), sql`${commission.id} = any(${sql.placeholder('ids')}::uuid[])`))
		.prepare('commission_cards_by_ids')
);

/** Cards for the given ids that are still open, by id; a commission closed since the index saw it is left out. */
export async function cardsByIds(db: Executor, ids: string[]): Promise<Map<string, CommissionCard>> {
	if (ids.length === 0) return new Map();
	const rows = await cardsStatement(db).execute({ ids });
	return new Map(
		rows.map(({ budgetMinMinor, budgetMaxMinor, currency, ...row }) => [
			row.id,
			{
				...row,
				budget:
					budgetMinMinor === null || budgetMaxMinor === null
						? null
						: { minMinor: budgetMinMinor, maxMinor: budgetMaxMinor, currency }
			}
		])
	);
}

/** Where the customer's most recent posted or drafted commission is (coarse): their place, for finding workrooms. */
export async function latestPlaceOf(db: Executor, customerId: string) {
	const [row] = await db
		.select({ lat: commission.approxLat, lng: commission.approxLng, town: commission.city })
		.from(commission)
		.where(and(eq(commission.customerId, customerId), isNotNull(commission.approxLat), isNotNull(commission.approxLng)))
		.orderBy(sql`${commission.updatedAt} desc`)
		.limit(1);
	return row ? { lat: row.lat!, lng: row.lng!, town: row.town } : null;
}
