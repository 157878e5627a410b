import { error, type Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';
import { handle as authjs } from '.';

/**
 * Auth.js's endpoints under /auth, guarded. Every sign-in, link request and sign-out goes through our
 * own form actions (which apply the limits and the same answers for everyone) and reach Auth.js
 * in-process, so a POST from outside is refused. What stays open: opening an emailed link (a GET to
 * /auth/callback/nodemailer), and /auth/session, which tells only a live, active session anything.
 */
export const authEndpoints: Handle = async ({ event, resolve }) => {
	const { pathname } = event.url;
	const isAuthPath = pathname === '/auth' || pathname.startsWith('/auth/');
	// Elsewhere the session is read from its cookie (./handle.ts); Auth.js has nothing to do.
	if (!isAuthPath) return resolve(event);
	if (isAuthPath && event.request.method !== 'GET' && event.request.method !== 'HEAD') {
		error(404, { message: 'Sign in on the sign-in page.', code: 'not_found' });
	}
	const response = await authjs({ event, resolve });
	if (pathname !== '/auth/session') return response;

	const session = await event.locals.auth();
	const id = session?.user?.id;
	const found = id ? await accounts.getSessionUser(event.locals.db, { id, sessionId: session.sessionId }) : null;
	if (found?.live && !found.suspended) return response;
	return new Response('null', {
		headers: { 'content-type': 'application/json', 'cache-control': 'private, no-store' }
	});
};
