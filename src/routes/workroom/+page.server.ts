import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const user = requireRole('tailor');
	return { user, openCommissions: await commissions.listOpen() };
};
