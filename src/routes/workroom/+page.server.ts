import { requireRole } from '$lib/server/auth/guard';
import * as payouts from '$lib/server/payouts';
import * as search from '$lib/server/search';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

/** How many of the nearest open commissions the workroom home shows before "See all". */
const nearYouCount = 4;

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole('tailor');
	const [workroom, onboarding, nearYou, payoutsReady] = await Promise.all([
		workrooms.getOwn(locals.db, { tailorId: user.id }),
		workrooms.onboardingStatus(locals.db, { tailorId: user.id }),
		search.browseForTailor(locals.db, {
			tailorId: user.id,
			query: search.schemas.nearbyCommissionsQuery.parse({ limit: String(nearYouCount) })
		}),
		payouts.ready(locals.db, user.id)
	]);
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
