import * as orders from '$lib/server/orders';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/**
 * The order's customer confirms delivery, which releases the payment: 202 with the order while the transfer is
 * on its way (`releaseRequestedAt` set), 200 once it is `released`. Repeating it asks for nothing more.
 */
export const POST: RequestHandler = (event) =>
	orderAction(
		event,
		orders.orderSchemas.emptyRequest,
		async ({ orderId, actor }) => {
			const row = await orders.confirmDelivery(event.locals.db, { orderId, actor });
			return { status: row.status === 'released' ? 200 : 202 };
		},
		{ optionalBody: true }
	);
