import type { Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';
import { SIGN_IN_LINK_LIFETIME_SECONDS } from '../limits/constants';

/** Someone who just proved they own the mailbox may set a new password without the old one. */
function isRecentLinkSignIn(session: { signedInWith?: string; signedInAt?: number } | null) {
	return (
		session?.signedInWith === 'nodemailer' &&
		Date.now() - (session.signedInAt ?? 0) < SIGN_IN_LINK_LIFETIME_SECONDS * 1000
	);
}

/** Auth.js's session cookie (`__Secure-` over https, `.0`, `.1`… when chunked); without one there is no session. */
const sessionCookie = 'authjs.session-token';

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
	if (!event.request.headers.get('cookie')?.includes(sessionCookie)) return resolve(event);
	const session = await event.locals.auth();
	const id = session?.user?.id;
	if (id) {
		const found = await accounts.getSessionUser(event.locals.db, { id, sessionId: session.sessionId });
		if (found?.suspended) event.locals.suspended = true;
		else if (found?.live) {
			event.locals.user = found.user;
			event.locals.sessionId = session.sessionId ?? null;
			event.locals.recentLinkSignIn = isRecentLinkSignIn(session);
		}
	}
	return resolve(event);
};
