import * as orders from '$lib/server/orders';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/** The order's tailor marks it delivered (pickup, or courier with tracking): 200 with the order. */
export const POST: RequestHandler = (event) =>
	orderAction(event, orders.orderSchemas.deliverRequest, async ({ orderId, actor, body }) => {
		await orders.markDelivered(event.locals.db, { orderId, actor, input: body });
		return { status: 200 };
	});
