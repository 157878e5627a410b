import { requireRole } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = () => {
	const user = requireRole('tailor');
	return {
		user,
		openCommissions: [] as { id: string; title: string; garmentType: string; sizeBand: string | null; city: string | null }[]
	};
};
