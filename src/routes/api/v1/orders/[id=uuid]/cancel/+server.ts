import * as orders from '$lib/server/orders';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/**
 * Either party cancels: an unpaid order at once; a paid one before work starts by agreement (the first call
 * asks, the other side's call agrees and the refund starts: 202); later, 409. `decline: true` turns a request
 * down. 200 with the order otherwise.
 */
export const POST: RequestHandler = (event) =>
	orderAction(
		event,
		orders.orderSchemas.cancelRequest,
		async ({ orderId, actor, body }) => {
			const db = event.locals.db;
			if (body.decline) {
				await orders.declineCancellation(db, { orderId, actor });
				return { status: 200 };
			}
			const { order, outcome } = await orders.cancel(db, { orderId, actor, reason: body.reason });
			return { status: outcome === 'agreed' || (order.refundRequestedAt && order.status !== 'refunded') ? 202 : 200 };
		},
		{ optionalBody: true }
	);
