import { requireRole } from '$lib/server/auth/guard';
import * as search from '$lib/server/search';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

/** How many of the nearest open commissions the workroom home shows before "See all". */
const nearYouCount = 4;
const nearYouQuery = search.schemas.nearbyCommissionsQuery.parse({ limit: String(nearYouCount) });

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole('tailor');
	// One read of the workroom row gives the page its name, onboarding, payouts and the list's centre.
	const { workroom, onboarding, payoutsReady } = await workrooms.home(locals.db, { tailorId: user.id });
	const nearYou = await search.browseForTailor(locals.db, { tailorId: user.id, query: nearYouQuery, workroom });
	return {
		user,
		workroom: workroom && { name: workroom.name, slug: workroom.slug },
		onboarding,
		payoutsReady,
		nearYou: nearYou.ok
			? {
					radiusKm: nearYou.origin.radiusKm,
					items: nearYou.items.map((item) => search.commissionItem(item, user.units)),
					more: nearYou.nextCursor !== null
				}
			: null
	};
};
