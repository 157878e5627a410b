import type { Handle } from '@sveltejs/kit';
import { env } from '$env/dynamic/private';
import * as accounts from '../accounts';
import { SIGN_IN_LINK_LIFETIME_SECONDS } from '../limits/constants';
import { readSessionToken, sessionCookieName } from './session-token';

/** Someone who just proved they own the mailbox may set a new password without the old one. */
function isRecentLinkSignIn(session: { signedInWith?: string; signedInAt?: number }) {
	return (
		session.signedInWith === 'nodemailer' &&
		Date.now() - (session.signedInAt ?? 0) < SIGN_IN_LINK_LIFETIME_SECONDS * 1000
	);
}

/**
 * Re-reads the user row and the session row on every request that carries a session cookie, so a role
 * change, a suspension or an ended session bites at once. A request without one is anonymous as it stands.
 */
export const loadUser: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.sessionId = null;
	event.locals.suspended = false;
	event.locals.guarded = false;
	event.locals.recentLinkSignIn = false;
	event.locals.dataVersion = null;
	event.locals.sessionEndsAt = null;
	const cookies = event.request.headers.get('cookie');
	if (!cookies?.includes(sessionCookieName)) return resolve(event);
	const token = await readSessionToken(cookies, { secure: event.url.protocol === 'https:', secret: env.AUTH_SECRET });
	const id = token?.sub;
	if (token && id) {
		const found = await accounts.getSessionUser(event.locals.db, { id, sessionId: token.sessionId });
		if (found?.suspended) event.locals.suspended = true;
		else if (found?.live) {
			event.locals.user = found.user;
			event.locals.sessionId = token.sessionId ?? null;
			event.locals.recentLinkSignIn = isRecentLinkSignIn(token);
			event.locals.dataVersion = found.dataVersion;
			event.locals.sessionEndsAt = token.exp ? token.exp * 1000 : null;
		}
	}
	return resolve(event);
};
