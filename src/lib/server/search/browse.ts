import type { Executor } from '../db';
import * as workrooms from '../workrooms';
import { nearbyCommissions } from './nearby';
import type { NearbyCommissionsQuery } from './schemas';

/** Where a tailor's list is centred and how far it reaches: asked for, or else their workroom's place and area. */
export type BrowseOrigin = {
	near: { lat: number; lng: number };
	radiusKm: number;
	fromWorkroom: boolean;
	town: string | null;
};

/** Radius when neither the request nor the workroom says. */
const fallbackRadiusKm = 25;

/**
 * A tailor's open commissions near them, as the API and the browse page both answer it. Without `near`,
 * the list centres on the tailor's workroom and reaches its service radius; a tailor who has not placed
 * their workroom yet must pass `near`.
 */
export async function browseForTailor(
	db: Executor,
	{
		tailorId,
		query,
		workroom
	}: {
		tailorId: string;
		query: NearbyCommissionsQuery;
		/** The tailor's workroom (its place and reach) when the caller has read it (null: none yet); read here otherwise. */
		workroom?: Pick<workrooms.ListOrigin, 'location' | 'serviceRadiusKm'> | null;
	}
) {
	let origin: BrowseOrigin | null = null;
	const own =
		workroom !== undefined
			? workroom
			: query.near && query.radiusKm !== undefined
				? null
				: await workrooms.listOrigin(db, { tailorId });
	if (query.near) {
		origin = {
			near: query.near,
			radiusKm: query.radiusKm ?? own?.serviceRadiusKm ?? fallbackRadiusKm,
			fromWorkroom: false,
			town: null
		};
	} else if (own && own.location.lat !== null && own.location.lng !== null) {
		origin = {
			near: { lat: own.location.lat, lng: own.location.lng },
			radiusKm: query.radiusKm ?? own.serviceRadiusKm,
			fromWorkroom: true,
			town: own.location.town
		};
	}
	if (!origin) return { ok: false as const };
	const { garment, budgetMin, budgetMax, dateNeededBefore, fabricSource, q } = query;
	const list = await nearbyCommissions(db, {
		near: origin.near,
		radiusKm: origin.radiusKm,
		filters: { garment, budgetMin, budgetMax, dateNeededBefore, fabricSource, q },
		sort: query.sort,
		after: query.cursor,
		limit: query.limit
	});
	return { ok: true as const, origin, ...list };
}
