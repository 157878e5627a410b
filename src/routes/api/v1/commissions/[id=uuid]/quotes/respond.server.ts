import * as quotes from '$lib/server/quotes';
import { apiError } from '$lib/server/http/respond';
import type { SessionUser } from '$lib/types/user';

/** A refused quote change as the API's error body; anything else is a real failure and is rethrown. */
export function quoteRefused(error: unknown) {
	if (!(error instanceof quotes.QuoteError)) throw error;
	return apiError(quotes.errorStatus[error.code], error.code, error.message, error.issues);
}

export function quoteActor(user: SessionUser, ip: string): quotes.Actor {
	return { id: user.id, role: user.role, ip };
}

export const noSuchQuote = () => apiError(404, 'not_found', 'There is no such quote.');
