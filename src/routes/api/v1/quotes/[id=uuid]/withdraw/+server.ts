import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import * as quotes from '$lib/server/quotes';
import { quoteActor, quoteRefused } from '../../../commissions/[id=uuid]/quotes/respond.server';
import type { RequestHandler } from './$types';

/** The quote's tailor takes it back while it waits for an answer; again is a no-op. */
export const POST: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const user = requireRole('tailor');
	try {
		const row = await quotes.withdraw(locals.db, { id: params.id, actor: quoteActor(user, getClientAddress()) });
		return json(quotes.quoteJson(row));
	} catch (error) {
		return quoteRefused(error);
	}
};
