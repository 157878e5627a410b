import { error, redirect } from '@sveltejs/kit';
import { getRequestEvent } from '$app/server';
import type { UserRole } from '../db/schema';
import type { SessionUser } from '$lib/types/user';

function isApiRequest(pathname: string) {
	return pathname.startsWith('/api/');
}

/** The signed-in, non-suspended user, or a redirect to sign in (pages) / 401 (API). */
export function requireUser(): SessionUser {
	const { locals, url } = getRequestEvent();
	locals.guarded = true;
	if (locals.user) return locals.user;
	if (isApiRequest(url.pathname)) error(401, { message: 'Sign in first.', code: 'unauthenticated' });
	if (locals.suspended) redirect(303, '/sign-in?suspended=1');
	redirect(303, `/sign-in?redirectTo=${encodeURIComponent(url.pathname + url.search)}`);
}

/** Like requireUser, and the user must hold one of the roles; others get 403. */
export function requireRole(...roles: UserRole[]): SessionUser {
	const user = requireUser();
	if (!roles.includes(user.role)) {
		error(403, { message: 'This area is not part of your account.', code: 'forbidden' });
	}
	return user;
}

/** Where each role starts after signing in. */
export function homeFor(role: UserRole) {
	return { customer: '/commissions', tailor: '/workroom', admin: '/desk' }[role];
}

/** Only same-site paths are followed after sign-in, as the URL parser reads them (tabs, newlines, backslashes). */
export function safeRedirectTarget(target: string | null | undefined, fallback: string) {
	if (!target || !target.startsWith('/') || target.startsWith('//') || target.startsWith('/\\')) return fallback;
	const base = 'http://same.invalid';
	let parsed: URL;
	try {
		parsed = new URL(target, base);
	} catch {
		return fallback;
	}
	if (parsed.origin !== base) return fallback;
	// The parser percent-encodes what a Location header cannot carry (an ideographic space, say).
	return parsed.pathname + parsed.search + parsed.hash;
}
