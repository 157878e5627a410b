import * as orders from '$lib/server/orders';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/** The order's customer asks for an alteration after delivery; the release clock waits. 200 with the order. */
export const POST: RequestHandler = (event) =>
	orderAction(event, orders.orderSchemas.alterationRequest, async ({ orderId, actor, body }) => {
		await orders.requestAlteration(event.locals.db, { orderId, actor, note: body.note });
		return { status: 200 };
	});
