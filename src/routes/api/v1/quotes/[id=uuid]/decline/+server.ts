import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import * as quotes from '$lib/server/quotes';
import { decidingActor, hasBody, refusedDecision } from '../decide.server';
import type { RequestHandler } from './$types';

/** The commission's owner declines a live quote, optionally saying why; the tailor is mailed. Answers the quote. */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('customer');
	let body: quotes.DeclineRequest = {};
	if (hasBody(request)) {
		const parsed = await parseJsonBody(request, quotes.declineRequestSchema);
		if (!parsed.ok) return parsed.response;
		body = parsed.data;
	}
	try {
		const row = await quotes.decline(locals.db, {
			quoteId: params.id,
			actor: decidingActor(user, getClientAddress()),
			reason: body.reason
		});
		return json(quotes.quoteJson(row));
	} catch (error) {
		return refusedDecision(error);
	}
};
