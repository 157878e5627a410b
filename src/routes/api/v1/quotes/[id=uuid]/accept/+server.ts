import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import * as quotes from '$lib/server/quotes';
import { decidingActor, hasBody, refusedDecision } from '../decide.server';
import type { RequestHandler } from './$types';

/**
 * The commission's owner accepts a quote: 201 with the order awaiting payment, or 409 when the commission
 * is no longer open (another quote won, it was cancelled or expired) or the quote is no longer live.
 */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('customer');
	if (hasBody(request)) {
		const parsed = await parseJsonBody(request, quotes.acceptRequestSchema);
		if (!parsed.ok) return parsed.response;
	}
	try {
		const order = await quotes.accept(locals.db, {
			quoteId: params.id,
			actor: decidingActor(user, getClientAddress())
		});
		return json(order, { status: 201 });
	} catch (error) {
		return refusedDecision(error);
	}
};
