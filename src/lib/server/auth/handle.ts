import type { Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';

/** Someone who just proved they own the mailbox may set a new password without the old one. */
const LINK_SIGN_IN_GRACE_MS = 15 * 60_000;

function isRecentLinkSignIn(session: { signedInWith?: string; signedInAt?: number } | null) {
	return session?.signedInWith === 'nodemailer' && Date.now() - (session.signedInAt ?? 0) < LINK_SIGN_IN_GRACE_MS;
}

/** Re-reads the user row on every request, so a role change or suspension bites at once. */
export const loadUser: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.suspended = false;
	event.locals.guarded = false;
	event.locals.recentLinkSignIn = false;
	const session = await event.locals.auth();
	const id = session?.user?.id;
	if (id) {
		const found = await accounts.getSessionUser({ id });
		if (found?.suspended) event.locals.suspended = true;
		else if (found) {
			event.locals.user = found.user;
			event.locals.recentLinkSignIn = isRecentLinkSignIn(session);
		}
	}
	return resolve(event);
};
