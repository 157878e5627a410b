import { decode, getToken, type JWT } from '@auth/core/jwt';

/** Auth.js's session cookie (`__Secure-` over https, `.0`, `.1`… when chunked). */
export const sessionCookieName = 'authjs.session-token';

/** Decrypting a token takes a key derivation and an AES-GCM pass; the same token decrypts the same way every time. */
const decoded = new Map<string, JWT>();
const keep = 1000;

async function decodeOnce(params: Parameters<typeof decode>[0]) {
	const { token } = params;
	if (!token) return null;
	const known = decoded.get(token);
	// Expiry is checked on every use, as decrypting does (with the same 15 s tolerance).
	if (known) return (known.exp ?? Infinity) * 1000 + 15_000 > Date.now() ? known : null;
	const payload = await decode(params);
	if (!payload) return null;
	if (decoded.size >= keep) decoded.delete(decoded.keys().next().value!);
	decoded.set(token, payload);
	return payload;
}

/**
 * The signed-in token carried by the request's cookie, or null: the same reading Auth.js's `auth()`
 * makes, without building a request for its session endpoint or re-issuing the cookie. The session
 * row it names is checked separately, on every request.
 */
export async function readSessionToken(
	cookieHeader: string,
	{ secure, secret }: { secure: boolean; secret: string | undefined }
) {
	try {
		return await getToken({
			req: { headers: { cookie: cookieHeader } },
			secret,
			secureCookie: secure,
			decode: decodeOnce
		});
	} catch {
		return null; // a token that does not decrypt (another secret, tampering) is no session
	}
}
