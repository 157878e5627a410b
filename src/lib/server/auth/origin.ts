import { env } from '$env/dynamic/private';

/**
 * The address people reach Tackline at, from configuration only: `Host` and `X-Forwarded-Host` are
 * whatever the sender wants them to be, so links we mail are never built from them.
 */
export function publicOrigin(): string {
	const configured = env.ORIGIN || env.AUTH_URL;
	if (!configured) throw new Error('Set ORIGIN (or AUTH_URL) to the public address of Tackline');
	return new URL(configured).origin;
}

/** The same URL moved onto the public origin. */
export function onPublicOrigin(url: string | URL): string {
	const parsed = new URL(url);
	return new URL(parsed.pathname + parsed.search + parsed.hash, publicOrigin()).toString();
}
