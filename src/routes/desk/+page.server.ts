import { requireRole } from '$lib/server/auth/guard';
import * as accounts from '$lib/server/accounts';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireRole('admin');
	return { user, openDisputes: [] as { id: string }[], userCounts: await accounts.countByRole(locals.db) };
};
