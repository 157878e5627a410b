import { MeilisearchApiError, type Meilisearch } from 'meilisearch';
import type { LatLng } from '$lib/geo/coarsen';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import { search } from '../services/search';
import * as workrooms from '../workrooms';
import { encodeCursor, type ListKey } from './cursor';
import { indexes } from './indexes';

type Hit = { id: string; distanceM: number; publishedMs: number };
type Sort = 'distance' | 'newest';

/** Where a list came from: the search index, or PostgreSQL while search is away. Same lists either way. */
export type ListSource = 'index' | 'database';

export type CommissionSearch = {
	near: LatLng;
	radiusKm: number;
	filters: commissions.NearbyCommissionFilters;
	sort: Sort;
	after?: ListKey | null;
	limit: number;
};

export type WorkroomSearch = {
	near: LatLng;
	radiusKm: number;
	filters: workrooms.searchDocuments.NearbyWorkroomFilters;
	after?: { distanceM: number; id: string } | null;
	limit: number;
};

/** Distances are shown to a tenth of a kilometre. */
const roundedKm = (metres: number) => Math.round(metres / 100) / 10;

const quoted = (value: string) => JSON.stringify(value);

function compareHits(sort: Sort) {
	return (a: Hit, b: Hit) => {
		if (sort === 'distance') return a.distanceM - b.distanceM || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
		return b.publishedMs - a.publishedMs || (a.id < b.id ? 1 : a.id > b.id ? -1 : 0);
	};
}

function isAfter(hit: Hit, after: ListKey | null | undefined, sort: Sort) {
	if (!after) return true;
	const key: Hit = {
		id: after.id,
		distanceM: 'distanceM' in after ? after.distanceM : 0,
		publishedMs: 'publishedMs' in after ? after.publishedMs : 0
	};
	return compareHits(sort)(key, hit) < 0;
}

/**
 * Reads `want` hits in the list's exact order from the index. The engine orders by its raw distance while
 * the list orders by whole metres then id, so hits tied with the last one fetched are only kept once the
 * fetch reaches past them; the fetch grows until it does (or the list ends).
 */
async function fromIndex(
	client: Meilisearch,
	uid: string,
	{
		q,
		filter,
		near,
		sort,
		after,
		want
	}: { q?: string; filter: string[]; near: LatLng; sort: Sort; after?: ListKey | null; want: number }
): Promise<Hit[]> {
	const order =
		sort === 'distance' ? [`_geoPoint(${near.lat}, ${near.lng}):asc`, 'id:asc'] : ['publishedAtMs:desc', 'id:desc'];
	const filters = [...filter];
	if (after && 'distanceM' in after && after.distanceM >= 1)
		filters.push(`NOT _geoRadius(${near.lat}, ${near.lng}, ${after.distanceM - 1})`);
	if (after && 'publishedMs' in after) filters.push(`publishedAtMs <= ${after.publishedMs}`);
	let fetch = want * 2 + 8;
	for (;;) {
		const response = await client.index(uid).search(q ?? null, {
			filter: filters.join(' AND '),
			sort: order,
			limit: fetch,
			offset: 0,
			attributesToRetrieve: ['id', 'publishedAtMs']
		});
		const hits: Hit[] = response.hits.map((hit) => ({
			id: String(hit.id),
			distanceM: Number(hit._geoDistance ?? 0),
			publishedMs: Number(hit.publishedAtMs ?? 0)
		}));
		const ordered = hits.filter((hit) => isAfter(hit, after, sort)).sort(compareHits(sort));
		const exhausted = hits.length < fetch;
		if (exhausted) return ordered.slice(0, want);
		const last = hits.at(-1)!;
		const certain = sort === 'distance' ? ordered.filter((hit) => hit.distanceM < last.distanceM) : ordered;
		if (certain.length >= want || fetch >= 1000) return certain.slice(0, want);
		fetch = Math.min(1000, fetch * 4);
	}
}

let lastWarning = 0;
function warnFallback(error: unknown) {
	// One line a minute at most: an outage would otherwise log on every request.
	if (Date.now() - lastWarning < 60_000) return;
	lastWarning = Date.now();
	console.warn(`[search] answering from PostgreSQL: ${error instanceof Error ? error.message : String(error)}`);
}

/**
 * After search could not be reached (refused, reset, timed out), lists come from PostgreSQL for this long
 * before search is tried again: requests during an outage do not each wait for the client's timeout.
 * An answer from search (even an error) proves it reachable and does not trip this.
 */
export const unreachablePauseMs = 1000;
const unreachableUntil = new WeakMap<Meilisearch, number>();

/** Search answered (the sync job reached it): lists go back to it at once, without waiting out the pause. */
export function reachable(client: Meilisearch) {
	unreachableUntil.delete(client);
}

/** Whether search itself answered (an API error) rather than not at all. */
const searchAnswered = (error: unknown) => error instanceof MeilisearchApiError;

/** Tries the index, and on any failure answers the same list from PostgreSQL. */
async function withFallback(
	client: () => Meilisearch,
	index: (client: Meilisearch) => Promise<Hit[]>,
	database: () => Promise<Hit[]>
) {
	let engine: Meilisearch | null = null;
	let failure: unknown = null;
	try {
		engine = client();
		if (Date.now() >= (unreachableUntil.get(engine) ?? 0))
			return { hits: await index(engine), source: 'index' as ListSource };
	} catch (error) {
		failure = error;
		if (engine && !searchAnswered(error)) unreachableUntil.set(engine, Date.now() + unreachablePauseMs);
	}
	if (failure) warnFallback(failure);
	return { hits: await database(), source: 'database' as ListSource };
}

function keyOf(hit: Hit, sort: Sort): ListKey {
	return sort === 'distance' ? { distanceM: hit.distanceM, id: hit.id } : { publishedMs: hit.publishedMs, id: hit.id };
}

function commissionFilter({ near, radiusKm, filters }: CommissionSearch) {
	const parts = [`_geoRadius(${near.lat}, ${near.lng}, ${Math.round(radiusKm * 1000)})`];
	if (filters.garment) parts.push(`garment = ${quoted(filters.garment)}`);
	if (filters.fabricSource) parts.push(`fabricSource = ${quoted(filters.fabricSource)}`);
	if (filters.budgetMin !== undefined) parts.push(`budgetMaxMinor >= ${filters.budgetMin}`);
	if (filters.budgetMax !== undefined) parts.push(`budgetMinMinor <= ${filters.budgetMax}`);
	if (filters.dateNeededBefore)
		parts.push(`dateNeededDay <= ${commissions.searchDocuments.epochDay(filters.dateNeededBefore)}`);
	return parts;
}

export type NearbyCommission = commissions.CommissionCard & { distanceKm: number };

/**
 * Open commissions near a point for a browsing tailor: search first, PostgreSQL when search fails.
 * Keyset-paged by an opaque cursor; the cards are read fresh, so a commission closed since the index saw
 * it drops out.
 */
export async function nearbyCommissions(
	db: Executor,
	query: CommissionSearch,
	client: () => Meilisearch = search
): Promise<{ items: NearbyCommission[]; nextCursor: string | null; source: ListSource }> {
	const want = query.limit + 1;
	const { hits, source } = await withFallback(
		client,
		(engine) =>
			fromIndex(engine, indexes.commission.uid, {
				q: query.filters.q,
				filter: commissionFilter(query),
				near: query.near,
				sort: query.sort,
				after: query.after,
				want
			}),
		() =>
			commissions.searchDocuments.nearbyFromDatabase(db, {
				near: query.near,
				radiusKm: Math.round(query.radiusKm * 1000) / 1000,
				filters: query.filters,
				sort: query.sort,
				after: query.after,
				limit: want
			})
	);
	const page = hits.slice(0, query.limit);
	const cards = await commissions.searchDocuments.cardsByIds(
		db,
		page.map((hit) => hit.id)
	);
	const items = page.flatMap((hit) => {
		const card = cards.get(hit.id);
		return card ? [{ ...card, distanceKm: roundedKm(hit.distanceM) }] : [];
	});
	const nextCursor = hits.length > query.limit ? encodeCursor(keyOf(page.at(-1)!, query.sort)) : null;
	return { items, nextCursor, source };
}

export type NearbyWorkroom = workrooms.searchDocuments.WorkroomCard & { distanceKm: number; servesYou: boolean };

/** Workrooms taking work near a point, nearest first: search first, PostgreSQL when search fails. */
export async function nearbyWorkrooms(
	db: Executor,
	query: WorkroomSearch,
	client: () => Meilisearch = search
): Promise<{ items: NearbyWorkroom[]; nextCursor: string | null; source: ListSource }> {
	const want = query.limit + 1;
	const filter = [`_geoRadius(${query.near.lat}, ${query.near.lng}, ${Math.round(query.radiusKm * 1000)})`];
	if (query.filters.specialty) filter.push(`specialties = ${quoted(query.filters.specialty)}`);
	const { hits, source } = await withFallback(
		client,
		(engine) =>
			fromIndex(engine, indexes.workroom.uid, {
				q: query.filters.q,
				filter,
				near: query.near,
				sort: 'distance',
				after: query.after,
				want
			}),
		async () =>
			(
				await workrooms.searchDocuments.nearbyFromDatabase(db, {
					near: query.near,
					radiusKm: Math.round(query.radiusKm * 1000) / 1000,
					filters: query.filters,
					after: query.after,
					limit: want
				})
			).map((hit) => ({ ...hit, publishedMs: 0 }))
	);
	const page = hits.slice(0, query.limit);
	const cards = await workrooms.searchDocuments.cardsByIds(
		db,
		page.map((hit) => hit.id)
	);
	const items = page.flatMap((hit) => {
		const card = cards.get(hit.id);
		if (!card) return [];
		const distanceKm = roundedKm(hit.distanceM);
		return [{ ...card, distanceKm, servesYou: hit.distanceM <= card.serviceRadiusKm * 1000 }];
	});
	const nextCursor = hits.length > query.limit ? encodeCursor(keyOf(page.at(-1)!, 'distance')) : null;
	return { items, nextCursor, source };
}
