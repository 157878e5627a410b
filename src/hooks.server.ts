import { sequence } from '@sveltejs/kit/hooks';
import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { gateAreas } from '$lib/server/auth/area-gate';
import { authEndpoints } from '$lib/server/auth/endpoints';
import { loadUser } from '$lib/server/auth/handle';
import { db } from '$lib/server/db';
import { securityHeaders } from '$lib/server/http/security-headers';
import { limitPublicApi } from '$lib/server/limits/handle';
import { startJobs, stopJobs } from '$lib/server/jobs/runner';
import * as mail from '$lib/server/mail';

/** Background jobs (mail and later ones) run in the app process; adapter-node's shutdown lets them finish. */
export const init: ServerInit = async () => {
	process.once('sveltekit:shutdown', () => void stopJobs());
	await startJobs();
	void mail.relayStatus(); // warm the health check's cache
};

/** Routes hand this to domain functions; tests and scripts pass their own handle. */
const provideDb: Handle = ({ event, resolve }) => {
	event.locals.db = db;
	return resolve(event);
};

export const handle = sequence(securityHeaders, provideDb, limitPublicApi, authEndpoints, loadUser, gateAreas);

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	if (status >= 500) console.error(`${event.request.method} ${event.url.pathname}`, error);
	return { message: status >= 500 ? 'Something went wrong on our side. Please try again.' : message, code: 'internal' };
};
