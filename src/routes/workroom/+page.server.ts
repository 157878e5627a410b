import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole('tailor');
	const [workroom, onboarding, openCommissions] = await Promise.all([
		workrooms.getOwn(locals.db, { tailorId: user.id }),
		workrooms.onboardingStatus(locals.db, { tailorId: user.id }),
		commissions.listOpen(locals.db)
	]);
	return {
		user,
		workroom: workroom && { name: workroom.name, slug: workroom.slug },
		onboarding,
		openCommissions
	};
};
