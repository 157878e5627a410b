import { error, redirect, type Handle } from '@sveltejs/kit';
import type { UserRole } from '../db/schema';

/** Pages inside another role's area that belong to this role: a tailor's quote on a customer's commission. */
const crossings: [pattern: RegExp, role: UserRole][] = [[/^\/commissions\/[0-9a-f-]{36}\/quote$/, 'tailor']];

const areas: [prefix: string, role: UserRole][] = [
	['/commissions', 'customer'],
	['/measurements', 'customer'],
	['/workroom', 'tailor'],
	['/desk', 'admin']
];

/**
 * The path as the router will read it, in one spelling: percent-escapes decoded (the router decodes
 * them too), runs of slashes collapsed, dot segments resolved, lower case. A path that does not decode
 * is kept as it is.
 */
export function normalisedPath(pathname: string) {
	let decoded = pathname;
	try {
		decoded = decodeURIComponent(pathname);
	} catch {
		// malformed escapes: the router will not match it to an area either
	}
	const collapsed = decoded.replace(/[\\/]+/g, '/');
	return new URL(collapsed, 'http://tackline.invalid').pathname.toLowerCase();
}

/**
 * A second line behind the per-route guards: area prefixes are closed to other roles. Errors thrown
 * here skip +error.svelte, so a GET goes through first and the route's own guard answers with the
 * proper page; if no guard ran, the gate refuses the response. Other methods never reach the route.
 */
export const gateAreas: Handle = async ({ event, resolve }) => {
	const path = normalisedPath(event.url.pathname);
	const crossing = crossings.find(([pattern]) => pattern.test(path));
	const area = crossing ?? areas.find(([prefix]) => path === prefix || path.startsWith(prefix + '/'));
	if (!area) return resolve(event);
	const user = event.locals.user;
	if (!user) {
		redirect(
			303,
			event.locals.suspended ? '/sign-in?suspended=1' : `/sign-in?redirectTo=${encodeURIComponent(event.url.pathname)}`
		);
	}
	if (user.role === area[1]) return resolve(event);
	if (event.request.method !== 'GET' && event.request.method !== 'HEAD') error(403, forbidden);
	const response = await resolve(event);
	if (event.locals.guarded) return response;
	console.error(`area gate stopped ${user.role} at ${path}: the route has no guard`);
	error(403, forbidden);
};

const forbidden = { message: 'This area is not part of your account.', code: 'forbidden' };
