import type { Handle } from '@sveltejs/kit';
import { currentVersion } from './version';

/**
 * GET answers that depend only on the database, the session, the address and the clock: reading them changes
 * nothing. server/private-answers.js may send such an answer again, to the same session (or to anyone, for
 * one rendered without a session), while the data version it was rendered at is still the current one, and
 * for at most half a minute (for the clock).
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
	'/workrooms',
	'/api/v1/commissions',
	'/api/v1/tailors'
]);

/** Read and removed by server/private-answers.js; never reaches the browser. */
export const keptAnswerHeader = 'x-tackline-keep';

/**
 * Marks a keepable answer with what the layer in front needs to check it later: the data version read before
 * anything else (with the session, by loadUser; here, for a request without one), the session and user it
 * was rendered for, and when the token ends. `enabled` is false where no such layer runs (the dev server),
 * so the mark is never sent there.
 */
export function markKeepableAnswers({ enabled, sessionCookie }: { enabled: boolean; sessionCookie: string }): Handle {
	return async ({ event, resolve }) => {
		const keepable = enabled && event.request.method === 'GET' && keepableRoutes.has(event.route.id ?? '');
		if (!keepable) return resolve(event);
		const anonymous = !event.request.headers.get('cookie')?.includes(sessionCookie);
		const anonymousVersion = anonymous ? await currentVersion(event.locals.db) : null;
		const response = await resolve(event);
		if (response.status !== 200 || response.headers.has('set-cookie') || event.locals.unkept) return response;
		const { user, sessionId, dataVersion, sessionEndsAt } = event.locals;
		const mark = anonymous
			? { v: anonymousVersion, s: '', u: '', e: 0 }
			: user && sessionId && dataVersion
				? { v: dataVersion, s: sessionId, u: user.id, e: sessionEndsAt ?? 0 }
				: null;
		if (!mark?.v) return response;
		try {
			response.headers.set(keptAnswerHeader, encodeURIComponent(JSON.stringify(mark)));
		} catch {
			// A response with fixed headers (a redirect built elsewhere) is simply not kept.
		}
		return response;
	};
}
