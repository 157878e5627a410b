import * as orders from '$lib/server/orders';
import * as payments from '$lib/server/payments';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/**
 * The order's customer approves the fabric the tailor showed, which pays the materials advance: 202 with the
 * order while the transfer is on its way, 200 once it has been paid.
 */
export const POST: RequestHandler = (event) =>
	orderAction(
		event,
		orders.orderSchemas.emptyRequest,
		async ({ orderId, actor }) => {
			const db = event.locals.db;
			await orders.approveFabric(db, { orderId, actor });
			const view = await payments.orderView(db, { orderId, viewer: actor });
			return { status: view.money.advancedMinor > 0 ? 200 : 202, answer: view };
		},
		{ optionalBody: true }
	);
