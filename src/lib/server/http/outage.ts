import type { Handle, RequestEvent } from '@sveltejs/kit';
import { apiError } from './respond';
import { isApiPath } from './api-errors';

/** Node socket errors and PostgreSQL SQLSTATEs that mean "the database cannot be reached", not "bad query". */
const socketCodes = new Set([
	'ECONNREFUSED',
	'ECONNRESET',
	'ETIMEDOUT',
	'EHOSTUNREACH',
	'ENETUNREACH',
	'ENOTFOUND',
	'EAI_AGAIN',
	'EPIPE'
]);
const unavailableStates = new Set(['57P01', '57P02', '57P03', '53300']);
const lostConnection =
	/Connection terminated|connection timeout|Client has encountered a connection error|timeout exceeded when trying to connect/i;

/** True when `error` (or anything in its cause chain) says the database is down or unreachable. */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
	if (!error || typeof error !== 'object' || depth > 5) return false;
	const { code, message, cause, errors } = error as {
		code?: unknown;
		message?: unknown;
		cause?: unknown;
		errors?: unknown;
	};
	if (typeof code === 'string' && (socketCodes.has(code) || unavailableStates.has(code) || code.startsWith('08')))
		return true;
	if (typeof message === 'string' && lostConnection.test(message)) return true;
	if (Array.isArray(errors) && errors.some((inner) => isDatabaseUnavailable(inner, depth + 1))) return true;
	return isDatabaseUnavailable(cause, depth + 1);
}

const retryAfterSeconds = 30;

const calmPage = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Back in a moment · Tackline</title><meta name="robots" content="noindex">
<style>body{margin:0;min-height:100vh;display:grid;place-items:center;background:#fcfaf6;color:#171923;font-family:Poppins,ui-sans-serif,system-ui,sans-serif}main{max-width:28rem;padding:2rem 1.5rem}p.status{color:#8a3120;font-weight:600;letter-spacing:.05em;margin:0}h1{font-size:1.728rem;line-height:1.3;margin:.5rem 0 1rem}a{color:#24495a}</style>
</head><body><main>
<p class="status">Back in a moment</p>
<h1>We can’t reach your records just now</h1>
<p>Nothing you saved is lost. Tackline’s records are briefly out of reach; please try again in a minute.</p>
<p><a href="">Try again</a> · <a href="/">Tackline’s home page</a></p>
</main></body></html>`;

/** 503 with a calm page (or the JSON error shape under /api) and a hint when to retry. */
export function outageResponse(pathname: string): Response {
	const headers = { 'retry-after': String(retryAfterSeconds), 'cache-control': 'no-store' };
	if (isApiPath(pathname)) {
		return apiError(503, 'unavailable', 'Tackline is briefly unavailable. Try again in a minute.', [], headers);
	}
	return new Response(calmPage, {
		status: 503,
		headers: {
			...headers,
			'content-type': 'text/html; charset=utf-8',
			'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'"
		}
	});
}

/** Requests whose rendering failed because the database was unreachable (noted by handleError). */
const failedOnDatabase = new WeakSet<Request>();

export function noteDatabaseOutage(event: RequestEvent) {
	failedOnDatabase.add(event.request);
}

/**
 * While the database is down, signed-in pages answer 503 with a calm page instead of a 500: errors thrown
 * by later handles (loading the user) are caught here; errors inside loads reach handleError, which notes them.
 */
export const databaseOutage: Handle = async ({ event, resolve }) => {
	let response: Response;
	try {
		response = await resolve(event);
	} catch (error) {
		if (!isDatabaseUnavailable(error)) throw error;
		console.error(`${event.request.method} ${event.url.pathname}: database unavailable`);
		return outageResponse(event.url.pathname);
	}
	if (response.status === 500 && failedOnDatabase.has(event.request)) return outageResponse(event.url.pathname);
	return response;
};
