/**
 * AWS Signature Version 4 as S3 checks it, for the S3 stand-in: header-signed requests and
 * presigned URLs (query-signed, with an expiry). Real S3 refuses a bad or stale signature, so the
 * stand-in does too — a client misconfiguration shows up locally, not first in production.
 */
import { createHash, createHmac, timingSafeEqual } from 'node:crypto';
import type { IncomingHttpHeaders } from 'node:http';

export type Credentials = { accessKeyId: string; secretAccessKey: string; region: string };
export type SignatureResult =
	{ ok: true; payloadHash: string } | { ok: false; status: number; code: string; message: string };

const algorithm = 'AWS4-HMAC-SHA256';
const maxSkewMs = 15 * 60 * 1000;
const maxPresignSeconds = 7 * 24 * 3600;

export const sha256Hex = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');
const hmac = (key: string | Buffer, data: string) => createHmac('sha256', key).update(data).digest();

/** RFC 3986 encoding, as SigV4 wants for query names and values. */
function encodeStrict(value: string) {
	return encodeURIComponent(value).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

function parseQuery(rawQuery: string): [string, string][] {
	if (!rawQuery) return [];
	return rawQuery.split('&').map((part) => {
		const index = part.indexOf('=');
		const name = index < 0 ? part : part.slice(0, index);
		const value = index < 0 ? '' : part.slice(index + 1);
		return [decodeURIComponent(name), decodeURIComponent(value)];
	});
}

function canonicalQuery(pairs: [string, string][]) {
	return pairs
		.map(([name, value]) => [encodeStrict(name), encodeStrict(value)])
		.sort(([a, av], [b, bv]) => (a < b ? -1 : a > b ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
		.map(([name, value]) => `${name}=${value}`)
		.join('&');
}

/** `20261202T040411Z` → milliseconds since the epoch, or NaN. */
function parseAmzDate(value: string) {
	const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(value);
	return m ? Date.UTC(+m[1], +m[2] - 1, +m[3], +m[4], +m[5], +m[6]) : NaN;
}

function headerValue(headers: IncomingHttpHeaders, name: string) {
	const value = headers[name];
	return (Array.isArray(value) ? value.join(',') : (value ?? '')).trim().replace(/\s+/g, ' ');
}

type Parts = {
	accessKeyId: string;
	scope: string;
	amzDate: string;
	signedHeaders: string[];
	signature: string;
	payloadHash: string;
	expiresSeconds: number | null;
	queryPairs: [string, string][];
};

function denied(code: string, message: string, status = 403): SignatureResult {
	return { ok: false, status, code, message };
}

function readParts(headers: IncomingHttpHeaders, pairs: [string, string][]): Parts | SignatureResult {
	const query = new Map(pairs);
	if (query.has('X-Amz-Signature')) {
		if (query.get('X-Amz-Algorithm') !== algorithm)
			return denied('AuthorizationQueryParametersError', 'Unsupported algorithm', 400);
		const [accessKeyId, ...scope] = (query.get('X-Amz-Credential') ?? '').split('/');
		const expires = Number(query.get('X-Amz-Expires'));
		if (!Number.isInteger(expires) || expires < 1 || expires > maxPresignSeconds)
			return denied('AuthorizationQueryParametersError', 'X-Amz-Expires must be between 1 and 604800 seconds', 400);
		return {
			accessKeyId,
			scope: scope.join('/'),
			amzDate: query.get('X-Amz-Date') ?? '',
			signedHeaders: (query.get('X-Amz-SignedHeaders') ?? '').split(';'),
			signature: query.get('X-Amz-Signature') ?? '',
			payloadHash: query.get('X-Amz-Content-Sha256') ?? 'UNSIGNED-PAYLOAD',
			expiresSeconds: expires,
			queryPairs: pairs.filter(([name]) => name !== 'X-Amz-Signature')
		};
	}
	const authorization = headerValue(headers, 'authorization');
	if (!authorization) return denied('AccessDenied', 'Anonymous access is not allowed');
	const m = /^AWS4-HMAC-SHA256 Credential=([^,]+), ?SignedHeaders=([^,]+), ?Signature=([0-9a-f]{64})$/.exec(
		authorization
	);
	if (!m) return denied('AuthorizationHeaderMalformed', 'The authorization header is malformed', 400);
	const [accessKeyId, ...scope] = m[1].split('/');
	return {
		accessKeyId,
		scope: scope.join('/'),
		amzDate: headerValue(headers, 'x-amz-date'),
		signedHeaders: m[2].split(';'),
		signature: m[3],
		payloadHash: headerValue(headers, 'x-amz-content-sha256') || 'UNSIGNED-PAYLOAD',
		expiresSeconds: null,
		queryPairs: pairs
	};
}

/** Checks a request's signature against the one set of credentials the stand-in accepts. */
export function verifySignature(
	request: { method: string; url: string; headers: IncomingHttpHeaders },
	credentials: Credentials,
	now = Date.now()
): SignatureResult {
	const queryStart = request.url.indexOf('?');
	const path = queryStart < 0 ? request.url : request.url.slice(0, queryStart);
	let pairs: [string, string][];
	try {
		pairs = parseQuery(queryStart < 0 ? '' : request.url.slice(queryStart + 1));
	} catch {
		return denied('InvalidArgument', 'Malformed query string', 400);
	}
	const parts = readParts(request.headers, pairs);
	if ('ok' in parts) return parts;

	if (parts.accessKeyId !== credentials.accessKeyId)
		return denied('InvalidAccessKeyId', 'The access key ID you provided does not exist in our records');
	const signedAt = parseAmzDate(parts.amzDate);
	const expectedScope = `${parts.amzDate.slice(0, 8)}/${credentials.region}/s3/aws4_request`;
	if (Number.isNaN(signedAt) || parts.scope !== expectedScope)
		return denied('AuthorizationHeaderMalformed', `The credential scope must be ${expectedScope}`, 400);
	if (!parts.signedHeaders.includes('host')) return denied('AccessDenied', 'The host header must be signed');
	if (signedAt - now > maxSkewMs) return denied('RequestTimeTooSkewed', 'The request time is too far in the future');
	if (parts.expiresSeconds === null && now - signedAt > maxSkewMs)
		return denied('RequestTimeTooSkewed', 'The difference between the request time and the current time is too large');
	if (parts.expiresSeconds !== null && now > signedAt + parts.expiresSeconds * 1000)
		return denied('AccessDenied', 'Request has expired');

	const canonicalRequest = [
		request.method,
		path,
		canonicalQuery(parts.queryPairs),
		parts.signedHeaders.map((name) => `${name}:${headerValue(request.headers, name)}\n`).join(''),
		parts.signedHeaders.join(';'),
		parts.payloadHash
	].join('\n');
	const stringToSign = [algorithm, parts.amzDate, parts.scope, sha256Hex(canonicalRequest)].join('\n');
	let key = hmac(`AWS4${credentials.secretAccessKey}`, parts.amzDate.slice(0, 8));
	for (const step of [credentials.region, 's3', 'aws4_request']) key = hmac(key, step);
	const expected = createHmac('sha256', key).update(stringToSign).digest();
	const given = Buffer.from(parts.signature, 'hex');
	if (given.length !== expected.length || !timingSafeEqual(given, expected))
		return denied(
			'SignatureDoesNotMatch',
			'The request signature we calculated does not match the signature you provided'
		);
	return { ok: true, payloadHash: parts.payloadHash };
}
