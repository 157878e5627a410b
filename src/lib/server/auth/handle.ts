import type { Handle } from '@sveltejs/kit';
import * as accounts from '../accounts';

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
