import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('customer');
	// The customer's day is read only when a draft's date needed must be judged against it.
	const today = async () => commissions.todayIn(await commissions.customerTimeZone(locals.db, user.id));
	return {
		user,
		commissions: await commissions.listForCustomer(locals.db, { customerId: user.id, today }),
		saved: url.searchParams.has('saved')
	};
};
