import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole('tailor');
	return { user, openCommissions: await commissions.listOpen(locals.db) };
};
