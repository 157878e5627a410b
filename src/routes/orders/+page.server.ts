import { redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/auth/guard';
import { listForCustomer } from '$lib/server/orders/board';
import type { PageServerLoad } from './$types';

/** A damaged cursor reads as "from the start" rather than as an error page. */
const query = z.object({ cursor: z.string().max(200).optional().catch(undefined) });

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireUser();
	// A workroom's orders are on its board, by stage and due date.
	if (user.role === 'tailor') redirect(303, '/workroom/orders');
	const { cursor } = query.parse(Object.fromEntries(url.searchParams));
	const page = await listForCustomer(locals.db, { customerId: user.id, cursor });
	return { ...page, paged: Boolean(cursor) };
};
