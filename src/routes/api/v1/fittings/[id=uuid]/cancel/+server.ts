import { requireRole } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import { parseJsonBody } from '$lib/server/http/respond';
import { changed, fittingActor } from '../../respond.server';
import type { RequestHandler } from './$types';

function hasBody(request: Request) {
	const length = request.headers.get('content-length');
	if (length === '0') return false;
	return length !== null || request.headers.has('transfer-encoding') || request.headers.has('content-type');
}

/**
 * The customer cancels their booking up to the cut-off; the tailor withdraws an open time or cancels a booking
 * (with a `reason`, which the customer is told). The body is optional.
 */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const actor = fittingActor(requireRole('customer', 'tailor'), getClientAddress());
	let body: fittings.CancelRequest = {};
	if (hasBody(request)) {
		const parsed = await parseJsonBody(request, fittings.cancelRequest);
		if (!parsed.ok) return parsed.response;
		body = parsed.data;
	}
	return changed(locals.db, actor, () => fittings.cancel(locals.db, { fittingId: params.id, actor, request: body }));
};
