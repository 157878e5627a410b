import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => {
	const user = requireRole('customer');
	return { user, commissions: await commissions.listForCustomer({ customerId: user.id }) };
};
