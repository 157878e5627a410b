import { error, redirect, type Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';
import type { UserRole } from '../db/schema';

/** Re-reads the user row on every request, so a role change or suspension bites at once. */
export const loadUser: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.suspended = false;
	event.locals.guarded = false;
	const session = await event.locals.auth();
	const id = session?.user?.id;
	if (id) {
		const found = await accounts.getSessionUser({ id });
		if (found?.suspended) event.locals.suspended = true;
		else if (found) event.locals.user = found.user;
	}
	return resolve(event);
};

const areas: [prefix: string, role: UserRole][] = [
	['/commissions', 'customer'],
	['/workroom', 'tailor'],
	['/desk', 'admin']
];

/**
 * A second line behind the per-route guards: area prefixes are closed to other roles. Errors thrown
 * here skip +error.svelte, so a GET goes through first and the route's own guard answers with the
 * proper page; if no guard ran, the gate refuses the response. Other methods never reach the route.
 */
export const gateAreas: Handle = async ({ event, resolve }) => {
	const path = event.url.pathname;
	const area = areas.find(([prefix]) => path === prefix || path.startsWith(prefix + '/'));
	if (!area) return resolve(event);
	const user = event.locals.user;
	if (!user) {
		redirect(303, event.locals.suspended ? '/sign-in?suspended=1' : `/sign-in?redirectTo=${encodeURIComponent(path)}`);
	}
	if (user.role === area[1]) return resolve(event);
	if (event.request.method !== 'GET' && event.request.method !== 'HEAD') error(403, forbidden);
	const response = await resolve(event);
	if (event.locals.guarded) return response;
	console.error(`area gate stopped ${user.role} at ${path}: the route has no guard`);
	error(403, forbidden);
};

const forbidden = { message: 'This area is not part of your account.', code: 'forbidden' };
