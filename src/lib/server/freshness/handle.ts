import type { Handle } from '@sveltejs/kit';

/**
 * Signed-in pages whose answer depends only on the database, the session, the address and the clock: reading
 * them changes nothing. server/private-answers.js may send such an answer again, to the same session, while the
 * data version it was rendered at is still the current one (and for at most half a minute, for the clock).
 */
export const keepableRoutes = new Set([
	'/',
	'/how-it-works',
	'/measurement-guide',
	'/draft-calculator',
	'/commissions',
	'/commissions/[id=uuid]',
	'/orders',
	'/orders/[id=uuid]',
	'/notifications',
	'/workroom',
	'/workroom/commissions',
	'/workroom/orders',
	'/workroom/quotes',
	'/workrooms'
]);

/** Read and removed by server/private-answers.js; never reaches the browser. */
export const keptAnswerHeader = 'x-tackline-keep';

/**
 * Marks a keepable answer with what the layer in front needs to check it later: the data version read with
 * the session (before anything else), the session and user it was rendered for, and when the token ends.
 * `enabled` is false where no such layer runs (the dev server), so the header is never sent there.
 */
export function keepSignedInAnswers({ enabled }: { enabled: boolean }): Handle {
	return async ({ event, resolve }) => {
		const response = await resolve(event);
		const { user, sessionId, dataVersion, sessionEndsAt } = event.locals;
		if (
			!enabled ||
			!user ||
			!sessionId ||
			!dataVersion ||
			event.request.method !== 'GET' ||
			response.status !== 200 ||
			response.headers.has('set-cookie') ||
			!keepableRoutes.has(event.route.id ?? '')
		) {
			return response;
		}
		const mark = { v: dataVersion, s: sessionId, u: user.id, e: sessionEndsAt ?? 0 };
		response.headers.set(keptAnswerHeader, encodeURIComponent(JSON.stringify(mark)));
		return response;
	};
}
