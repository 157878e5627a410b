import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/auth/guard';
import { orderPageData } from './order.server';
import type { PageServerLoad } from './$types';

/** The confirmation a link asked for (`?ask=confirm`): anything else reads as none. */
const askSchema = z.enum(['confirm', 'cancel']).optional().catch(undefined);

export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = requireUser();
	const data = await orderPageData(locals.db, { orderId: params.id, user });
	if (!data) error(404, { message: 'There is no such order.', code: 'not_found' });
	return {
		...data,
		ask: askSchema.parse(url.searchParams.get('ask') ?? undefined) ?? null,
		done: z
			.enum(['progress', 'ready', 'delivered', 'confirmed', 'alteration', 'fabric', 'cancelled', 'cancel-asked'])
			.optional()
			.catch(undefined)
			.parse(url.searchParams.get('done') ?? undefined) ?? null
	};
};
