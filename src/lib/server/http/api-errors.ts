import { isHttpError, isRedirect, type Handle } from '@sveltejs/kit';
import { describeForLog } from './redact';
import { apiError, isShapedError } from './respond';

export const isApiPath = (pathname: string) => pathname === '/api' || pathname.startsWith('/api/');

const defaults: Record<number, { code: string; message: string }> = {
	400: { code: 'bad_request', message: 'The request could not be understood.' },
	401: { code: 'unauthenticated', message: 'Sign in first.' },
	403: { code: 'forbidden', message: 'This request is not allowed.' },
	404: { code: 'not_found', message: 'There is nothing at this address.' },
	405: { code: 'method_not_allowed', message: 'This address does not answer that method.' },
	413: { code: 'too_large', message: 'The request is too large.' },
	415: { code: 'unsupported_media_type', message: 'Send the body as JSON with Content-Type: application/json.' },
	429: { code: 'too_many_requests', message: 'Too many requests. Wait a little, then try again.' },
	503: { code: 'unavailable', message: 'Tackline is briefly unavailable. Try again in a minute.' }
};

function fallbackFor(status: number) {
	return (
		defaults[status] ??
		(status >= 500 ? { code: 'internal', message: 'Something went wrong on our side.' } : defaults[400])
	);
}

const keptHeaders = ['allow', 'retry-after', 'cache-control', 'www-authenticate'];

/** Any error answer under /api — thrown errors, 405s, Kit's own text — becomes `{ error: { code, message, issues } }`. */
export async function toApiError(response: Response): Promise<Response> {
	// Successes, and our own error answers, which are in the shape already (checked without reading them).
	if (response.status < 400 || isShapedError(response)) return response;
	const type = response.headers.get('content-type') ?? '';
	let { code, message } = fallbackFor(response.status);
	if (type.includes('application/json')) {
		const body = (await response
			.clone()
			.json()
			.catch(() => null)) as { error?: { code?: unknown }; message?: unknown; code?: unknown } | null;
		// Already our shape, or an endpoint's own report (the health check's 503): leave it as it is.
		if (body && (body.error?.code || typeof body.message !== 'string')) return response;
		if (body && response.status < 500 && typeof body.message === 'string') message = body.message;
		if (typeof body?.code === 'string') code = body.code;
	}
	if (response.status === 405) {
		const allow = response.headers.get('allow');
		if (allow) message = `This address does not answer that method. It answers ${allow}.`;
	}
	const headers = new Headers();
	for (const name of keptHeaders) {
		const value = response.headers.get(name);
		if (value) headers.set(name, value);
	}
	for (const cookie of response.headers.getSetCookie()) headers.append('set-cookie', cookie);
	return apiError(response.status, code, message, [], headers);
}

/** Under /api, errors come back as JSON whatever the client asked for; the error shape is reshaped above. */
export const apiErrorShape: Handle = async ({ event, resolve }) => {
	if (!isApiPath(event.url.pathname)) return resolve(event);
	try {
		event.request.headers.set('accept', 'application/json');
	} catch {
		// immutable headers: the HTML error page is replaced by the default message instead
	}
	let response: Response;
	try {
		response = await resolve(event);
	} catch (error) {
		// Thrown by a later handle, so SvelteKit would answer outside this shape.
		if (isRedirect(error)) throw error;
		if (isHttpError(error)) return toApiError(Response.json(error.body, { status: error.status }));
		console.error(`${event.request.method} ${event.url.pathname}\n${describeForLog(error)}`);
		return apiError(500, 'internal', fallbackFor(500).message);
	}
	return toApiError(response);
};
