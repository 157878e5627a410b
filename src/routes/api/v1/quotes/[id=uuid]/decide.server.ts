import * as quotes from '$lib/server/quotes';
import { apiError } from '$lib/server/http/respond';
import type { SessionUser } from '$lib/types/user';

/** A refused decision as the API's error body; anything else is a real failure and is rethrown. */
export function refusedDecision(error: unknown) {
	if (!(error instanceof quotes.QuoteError)) throw error;
	return apiError(quotes.errorStatus[error.code], error.code, error.message, error.issues);
}

export function decidingActor(user: SessionUser, ip: string): quotes.DecidingActor {
	return { id: user.id, role: user.role, ip };
}

/** Whether the request carries a body at all: a decline or an acceptance may be sent bare, even with a content type. */
export function hasBody(request: Request) {
	const length = request.headers.get('content-length');
	if (length === '0') return false;
	return length !== null || request.headers.has('transfer-encoding') || request.headers.has('content-type');
}
