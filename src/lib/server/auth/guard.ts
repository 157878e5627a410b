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

const probeOrigin = 'http://tackline.invalid';

/**
 * Only same-site paths are followed after sign-in. The target is read the way a browser would read
 * it (the URL parser drops tabs and newlines and turns `\\` into `/`), and what comes out must still
 * be a path on our origin; anything with control characters, spaces or backslashes is refused outright.
 */
export function safeRedirectTarget(target: string | null | undefined, fallback: string) {
	if (!target || !target.startsWith('/') || /[\p{Cc}\p{Z}\\]/u.test(target)) return fallback;
	let parsed: URL;
	try {
		parsed = new URL(target, probeOrigin);
	} catch {
		return fallback;
	}
	const path = parsed.pathname + parsed.search + parsed.hash;
	if (parsed.origin !== probeOrigin || !path.startsWith('/') || path.startsWith('//')) return fallback;
	return path;
}
