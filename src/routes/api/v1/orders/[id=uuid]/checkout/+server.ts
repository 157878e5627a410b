import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import * as payments from '$lib/server/payments';
import { refusedPayment } from '../refused.server';
import type { RequestHandler } from './$types';

function hasBody(request: Request) {
	const length = request.headers.get('content-length');
	return request.headers.has('content-type') || (length !== null && length !== '0');
}

/**
 * The order's customer starts paying: 201 with the hosted payment page's URL (the same open session again on
 * a second call), 409 when the order is not awaiting payment.
 */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireUser();
	if (hasBody(request)) {
		const parsed = await parseJsonBody(request, payments.schemas.checkoutRequest);
		if (!parsed.ok) return parsed.response;
	}
	try {
		const started = await payments.startCheckout(locals.db, {
			orderId: params.id,
			actor: { id: user.id, role: user.role, ip: getClientAddress() }
		});
		return json({ url: started.url }, { status: 201 });
	} catch (error) {
		return refusedPayment(error);
	}
};
