import { json } from '@sveltejs/kit';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import * as quotes from '$lib/server/quotes';
import { noSuchQuote, quoteActor, quoteRefused } from '../../commissions/[id=uuid]/quotes/respond.server';
import type { RequestHandler } from './$types';

/** A quote for its parties: its tailor, the commission's owner, admins. Everyone else gets 404. */
export const GET: RequestHandler = async ({ params, locals }) => {
	const user = requireUser();
	const row = await quotes.getForParty(locals.db, { id: params.id, viewer: user });
	return row ? json(quotes.quoteJson(row)) : noSuchQuote();
};

/** The quote's tailor changes any of its terms while it waits for an answer. */
export const PATCH: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('tailor');
	const parsed = await parseJsonBody(request, quotes.quotePatch);
	if (!parsed.ok) return parsed.response;
	try {
		const edited = await quotes.edit(locals.db, {
			id: params.id,
			actor: quoteActor(user, getClientAddress()),
			changes: parsed.data
		});
		return json(quotes.quoteJson(edited.quote, edited.warnings));
	} catch (error) {
		return quoteRefused(error);
	}
};
