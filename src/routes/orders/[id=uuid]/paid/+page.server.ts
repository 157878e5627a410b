import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/auth/guard';
import * as payments from '$lib/server/payments';
import type { Actions, PageServerLoad } from './$types';

/** Unknown or damaged parameters read as "no session": the page then shows what our records say. */
const query = z.object({
	session_id: z
		.string()
		.regex(/^cs_[A-Za-z0-9_]{1,200}$/)
		.optional()
		.catch(undefined),
	cancelled: z.literal('1').optional().catch(undefined)
});

export const load: PageServerLoad = async ({ params, url, locals }) => {
	const user = requireUser();
	const { session_id: sessionId, cancelled } = query.parse(Object.fromEntries(url.searchParams));
	let order: payments.OrderView;
	try {
		order = await payments.orderView(locals.db, { orderId: params.id, viewer: user });
	} catch (problem) {
		if (problem instanceof payments.PaymentError) error(404, { message: 'There is no such order.', code: 'not_found' });
		throw problem;
	}
	let unreachable = false;
	// Back from the hosted page: ask the processor, so a paid order shows as paid (and a refused card its
	// reason) before the webhook arrives.
	if ((sessionId || cancelled) && user.id === order.customerId && order.status === 'awaiting_payment') {
		try {
			if (sessionId) await payments.syncFromSession(locals.db, { sessionId, orderId: order.id });
			else await payments.syncOrder(locals.db, { orderId: order.id });
			order = await payments.orderView(locals.db, { orderId: params.id, viewer: user });
		} catch (problem) {
			if (!(problem instanceof payments.PaymentError)) throw problem;
			unreachable = problem.code === 'unavailable';
		}
	}
	return {
		order,
		isCustomer: user.id === order.customerId,
		returned: Boolean(sessionId),
		cancelled: Boolean(cancelled),
		unreachable
	};
};

export const actions: Actions = {
	/** The customer opens (or reopens) the hosted payment page. */
	pay: async ({ params, locals, getClientAddress }) => {
		const user = requireUser();
		let url: string;
		try {
			({ url } = await payments.startCheckout(locals.db, {
				orderId: params.id,
				actor: { id: user.id, role: user.role, ip: getClientAddress() }
			}));
		} catch (problem) {
			if (!(problem instanceof payments.PaymentError)) throw problem;
			if (problem.code === 'not_found') error(404, { message: 'There is no such order.', code: 'not_found' });
			return fail(payments.errorStatus[problem.code], { message: problem.message });
		}
		redirect(303, url);
	}
};
