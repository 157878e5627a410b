import { json } from '@sveltejs/kit';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import * as quotes from '$lib/server/quotes';
import { quoteActor, quoteRefused } from './respond.server';
import type { RequestHandler } from './$types';

/** The commission's owner (and admins) see every quote, live and past; a tailor only their own. */
export const GET: RequestHandler = async ({ params, locals }) => {
	const user = requireUser();
	const rows = await quotes.listForCommission(locals.db, { commissionId: params.id, viewer: user });
	if (!rows) return apiError(404, 'not_found', 'There is no such commission.');
	return json({ items: rows.map((row) => quotes.quoteJson(row)) });
};

/** A tailor with complete onboarding quotes on an open commission: 201 with the quote and its warnings. */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('tailor');
	const parsed = await parseJsonBody(request, quotes.quoteCreate);
	if (!parsed.ok) return parsed.response;
	try {
		const sent = await quotes.send(locals.db, {
			commissionId: params.id,
			actor: quoteActor(user, getClientAddress()),
			terms: parsed.data
		});
		return json(quotes.quoteJson(sent.quote, sent.warnings), {
			status: 201,
			headers: { location: `/api/v1/quotes/${sent.quote.id}` }
		});
	} catch (error) {
		return quoteRefused(error);
	}
};
