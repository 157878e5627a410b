import { and, asc, eq, gt, inArray, sql, type SQL } from 'drizzle-orm';
import type { GarmentId } from '$lib/drafting';
import { boundingBox } from '$lib/geo/distance';
import type { LatLng } from '$lib/geo/coarsen';
import type { Executor } from '../db';
import { tailorProfile, user } from '../db/schema';
import { cardColumns, findable, toCards } from './cards';

/** What the search index holds for a workroom taking work: name, words, specialties and its coarse point. */
export type WorkroomSearchDocument = {
	id: string;
	name: string;
	bio: string;
	town: string;
	specialties: string[];
	_geo: LatLng;
};

export type NearbyWorkroomFilters = { specialty?: GarmentId; q?: string };

const documentColumns = {
	id: tailorProfile.userId,
	name: tailorProfile.shopName,
	bio: tailorProfile.bio,
	town: tailorProfile.city,
	specialties: tailorProfile.specialties,
	lat: tailorProfile.lat,
	lng: tailorProfile.lng
};

function toDocument({ lat, lng, ...row }: { lat: number; lng: number } & Omit<WorkroomSearchDocument, '_geo'>) {
	return { ...row, _geo: { lat, lng } };
}

/** The documents of those workrooms that belong in the index; the rest are to be removed. */
export async function searchDocuments(db: Executor, ids: string[]): Promise<WorkroomSearchDocument[]> {
	if (ids.length === 0) return [];
	const rows = await db
		.select(documentColumns)
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(and(findable, inArray(tailorProfile.userId, ids)));
	return rows.map(toDocument);
}

/** Every findable workroom's document in id order, a page at a time, for a full rebuild. */
export async function allSearchDocuments(
	db: Executor,
	{ afterId, limit = 1000 }: { afterId?: string; limit?: number }
): Promise<WorkroomSearchDocument[]> {
	const rows = await db
		.select(documentColumns)
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(and(findable, afterId ? gt(tailorProfile.userId, afterId) : undefined))
		.orderBy(asc(tailorProfile.userId))
		.limit(limit);
	return rows.map(toDocument);
}

function escapeLike(word: string) {
	return word.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** Haversine metres on the WGS-84 mean radius, as the search engine computes `_geoDistance`. */
function haversineMetres(near: LatLng) {
	return sql<number>`(2 * 6371008.8 * asin(least(1, sqrt(
		power(sin(radians(${tailorProfile.lat} - ${near.lat}::float8) / 2), 2)
		+ cos(radians(${near.lat}::float8)) * cos(radians(${tailorProfile.lat})) * power(sin(radians(${tailorProfile.lng} - ${near.lng}::float8) / 2), 2)
	))))`;
}

/**
 * Findable workrooms within `radiusKm` of `near`, nearest first, straight from PostgreSQL: the list search
 * gives when it is up. The bounding box runs on the indexed coordinates, then the exact distance decides.
 */
export async function nearbyFromDatabase(
	db: Executor,
	search: NearbySearch
): Promise<{ id: string; distanceM: number }[]> {
	const result = await db.execute(nearbyQuery(search));
	return (result.rows as { id: string; distanceM: number }[]).map((row) => ({
		id: row.id,
		distanceM: Number(row.distanceM)
	}));
}

export type NearbySearch = {
	near: LatLng;
	radiusKm: number;
	filters: NearbyWorkroomFilters;
	after?: { distanceM: number; id: string } | null;
	limit: number;
};

/** The statement behind `nearbyFromDatabase`, apart so that a test can EXPLAIN it. */
export function nearbyQuery({ near, radiusKm, filters, after, limit }: NearbySearch): SQL {
	const box = boundingBox(near, radiusKm);
	const conditions: SQL[] = [
		sql`${tailorProfile.lat} between ${box.minLat} and ${box.maxLat}`,
		sql`${tailorProfile.lng} between ${box.minLng} and ${box.maxLng}`,
		sql`${tailorProfile.onboardedAt} is not null`,
		sql`${tailorProfile.acceptingWork}`,
		sql`${user.suspendedAt} is null`,
		sql`${user.role} = 'tailor'`
	];
	if (filters.specialty) conditions.push(sql`${tailorProfile.specialties} @> array[${filters.specialty}]::text[]`);
	for (const word of (filters.q ?? '').trim().split(/\s+/).filter(Boolean).slice(0, 8)) {
		const pattern = `%${escapeLike(word)}%`;
		conditions.push(sql`(${tailorProfile.shopName} ilike ${pattern} or ${tailorProfile.bio} ilike ${pattern})`);
	}
	const keyset = after ? sql`(round(s.raw_m)::int, s.id) > (${after.distanceM}::int, ${after.id}::uuid)` : sql`true`;
	return sql`
		select s.id, round(s.raw_m)::int as "distanceM"
		from (
			select ${tailorProfile.userId} as id, ${haversineMetres(near)} as raw_m
			from ${tailorProfile} join ${user} on ${user.id} = ${tailorProfile.userId}
			where ${sql.join(conditions, sql` and `)}
		) s
		where s.raw_m <= ${radiusKm * 1000}::float8 and ${keyset}
		order by round(s.raw_m)::int, s.id
		limit ${limit}`;
}

/** A findable workroom as the near-me list shows it. */
export type WorkroomCard = {
	id: string;
	slug: string;
	name: string;
	town: string;
	district: string | null;
	specialties: GarmentId[];
	serviceRadiusKm: number;
	coverPhotoId: string | null;
	reviews: { count: number; averageHundredths: number | null };
};

/** Cards for the given ids that are still findable, by id. */
export async function cardsByIds(db: Executor, ids: string[]): Promise<Map<string, WorkroomCard>> {
	if (ids.length === 0) return new Map();
	const rows = await db
		.select({ ...cardColumns, serviceRadiusKm: tailorProfile.serviceRadiusKm })
		.from(tailorProfile)
		.innerJoin(user, eq(user.id, tailorProfile.userId))
		.where(and(findable, inArray(tailorProfile.userId, ids)));
	return new Map((await toCards(db, rows)).map((card) => [card.id, card]));
}
