import { safeRedirectTarget } from '$lib/server/auth/guard';

/** `?return=`: where to go back to after saving (the commission form), same-site paths only. */
export function returnTarget(value: string | null | undefined) {
	return safeRedirectTarget(value, '') || null;
}

/** The return address with the saved profile's id added, so the page there can pick it. */
export function backWith(target: string, profileId: string) {
	const url = new URL(target, 'http://tackline.invalid');
	url.searchParams.set('profile', profileId);
	return url.pathname + url.search + url.hash;
}
