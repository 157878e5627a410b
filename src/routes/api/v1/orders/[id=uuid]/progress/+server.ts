import * as orders from '$lib/server/orders';
import { orderAction } from '../action.server';
import type { RequestHandler } from './$types';

/** The order's tailor posts a progress step: 201 with the step (200 with the first one for a repeat). */
export const POST: RequestHandler = (event) =>
	orderAction(event, orders.orderSchemas.progressRequest, async ({ orderId, actor, body }) => {
		const posted = await orders.postProgress(event.locals.db, { orderId, actor, input: body });
		const { step } = posted;
		return {
			status: posted.created ? 201 : 200,
			answer: {
				id: step.id,
				step: step.kind,
				note: step.note,
				recordedAt: step.recordedAt.toISOString(),
				photo:
					step.photoKey && step.photoWidth && step.photoHeight
						? { width: step.photoWidth, height: step.photoHeight, alt: step.photoAlt }
						: null
			}
		};
	});
