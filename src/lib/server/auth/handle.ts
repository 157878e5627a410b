import { error, redirect, type Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';
import type { UserRole } from '../db/schema';

/** Re-reads the user row on every request, so a role change or suspension bites at once. */
export const loadUser: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.suspended = false;
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

/** A second line behind the per-route guards: area prefixes are closed to other roles. */
export const gateAreas: Handle = async ({ event, resolve }) => {
	const path = event.url.pathname;
	const area = areas.find(([prefix]) => path === prefix || path.startsWith(prefix + '/'));
	if (area) {
		const user = event.locals.user;
		if (!user)
			redirect(
				303,
				event.locals.suspended ? '/sign-in?suspended=1' : `/sign-in?redirectTo=${encodeURIComponent(path)}`
			);
		if (user.role !== area[1]) error(403, { message: 'This area is not part of your account.', code: 'forbidden' });
	}
	return resolve(event);
};
