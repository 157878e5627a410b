import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import * as payments from '$lib/server/payments';
import { refusedPayment } from './refused.server';
import type { RequestHandler } from './$types';

/** Either party of the order, or an admin: the order with its money from the ledger. */
export const GET: RequestHandler = async ({ params, locals }) => {
	const user = requireUser();
	try {
		return json(await payments.orderView(locals.db, { orderId: params.id, viewer: user }));
	} catch (error) {
		return refusedPayment(error);
	}
};
