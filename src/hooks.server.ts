import { sequence } from '@sveltejs/kit/hooks';
import type { Handle, HandleServerError } from '@sveltejs/kit';
import { handle as authjs } from '$lib/server/auth';
import { gateAreas } from '$lib/server/auth/area-gate';
import { loadUser } from '$lib/server/auth/handle';
import { db } from '$lib/server/db';
import { httpHandles } from '$lib/server/http';
import { isDatabaseUnavailable, noteDatabaseOutage } from '$lib/server/http/outage';
import { describeForLog, redact } from '$lib/server/http/redact';

/** Routes hand this to domain functions; tests and scripts pass their own handle. */
const provideDb: Handle = ({ event, resolve }) => {
	event.locals.db = db;
	return resolve(event);
};

export const handle = sequence(httpHandles, provideDb, authjs, loadUser, gateAreas);

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	const where = redact(`${event.request.method} ${event.url.pathname}`);
	if (isDatabaseUnavailable(error)) {
		noteDatabaseOutage(event);
		console.error(`${where}: database unavailable`);
		return { message: 'Tackline is briefly unavailable. Please try again in a minute.', code: 'unavailable' };
	}
	if (status >= 500) {
		console.error(`${where}\n${describeForLog(error)}`);
		return { message: 'Something went wrong on our side. Please try again.', code: 'internal' };
	}
	// 4xx raised by SvelteKit itself (an unknown action, a body it refuses): the message says what was wrong.
	const codes: Record<number, string> = {
		404: 'not_found',
		405: 'method_not_allowed',
		413: 'too_large',
		415: 'unsupported_media_type'
	};
	return { message, code: codes[status] ?? 'bad_request' };
};
