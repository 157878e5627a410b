import { requireRole } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = () => {
	const user = requireRole('customer');
	return { user, commissions: [] as { id: string; title: string; status: string; quoteCount: number }[] };
};
