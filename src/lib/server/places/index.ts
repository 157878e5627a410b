import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { localPlace, type NewLocalPlace } from '../db/schema';
import {
	gazetteerCountries,
	gazetteerPlace,
	nearestGazetteerPlace,
	normaliseName,
	searchGazetteer,
	type Place
} from './gazetteer';

export type { Place } from './gazetteer';

function fromLocal(row: typeof localPlace.$inferSelect): Place {
	return {
		id: `local:${row.id}`,
		name: row.name,
		admin: row.admin,
		country: row.country,
		lat: row.lat,
		lng: row.lng,
		population: 0
	};
}

function likePrefix(text: string) {
	return `${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** Places whose name starts with `q`, local ones (districts, the demo city) first, then the gazetteer. */
export async function searchPlaces(
	db: Executor,
	{ q, country, limit = 8 }: { q: string; country?: string; limit?: number }
): Promise<Place[]> {
	const local = await db
		.select()
		.from(localPlace)
		.where(
			and(
				sql`lower(${localPlace.name}) like ${likePrefix(q.trim().toLowerCase())}`,
				country ? eq(localPlace.country, country) : undefined
			)
		)
		.orderBy(localPlace.name)
		.limit(limit);
	const listed = searchGazetteer(q, { country, limit: limit - local.length });
	return [...local.map(fromLocal), ...listed];
}

export async function placeById(db: Executor, id: string): Promise<Place | null> {
	const [source, key] = id.split(/:(.*)/s, 2);
	if (source === 'geonames' && /^\d{1,10}$/.test(key ?? '')) return gazetteerPlace(Number(key));
	if (source === 'local' && key) {
		const [row] = await db.select().from(localPlace).where(eq(localPlace.id, key)).limit(1);
		return row ? fromLocal(row) : null;
	}
	return null;
}

/** The named place nearest a point: a local one within 3 km wins over the gazetteer. */
export async function nearestPlace(db: Executor, { lat, lng }: { lat: number; lng: number }): Promise<Place | null> {
	const [local] = await db
		.select()
		.from(localPlace)
		.where(sql`abs(${localPlace.lat} - ${lat}) < 0.03 and abs(${localPlace.lng} - ${lng}) < 0.05`)
		.orderBy(sql`(${localPlace.lat} - ${lat})^2 + ((${localPlace.lng} - ${lng}) * cos(radians(${lat})))^2`)
		.limit(1);
	if (local) return fromLocal(local);
	return nearestGazetteerPlace(lat, lng)?.place ?? null;
}

/** Adds places the gazetteer lacks (districts, the demo city); existing ids are left as they are. */
export async function addLocalPlaces(db: Executor, places: NewLocalPlace[]) {
	if (places.length === 0) return;
	await db.insert(localPlace).values(places).onConflictDoNothing();
}

export async function countries(db: Executor): Promise<string[]> {
	const local = await db.selectDistinct({ country: localPlace.country }).from(localPlace);
	return [...new Set([...gazetteerCountries(), ...local.map((r) => r.country)])].sort();
}

export { normaliseName };
