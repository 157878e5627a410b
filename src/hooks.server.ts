import { sequence } from '@sveltejs/kit/hooks';
import type { Handle, HandleServerError, ResolveOptions, ServerInit } from '@sveltejs/kit';
import { building, dev } from '$app/environment';
import { gateAreas } from '$lib/server/auth/area-gate';
import { authEndpoints } from '$lib/server/auth/endpoints';
import { loadUser } from '$lib/server/auth/handle';
import { markKeepableAnswers, openFrontDoor } from '$lib/server/freshness';
import { sessionCookieName } from '$lib/server/auth/session-token';
import { publicApi } from '$lib/server/limits';
import { db } from '$lib/server/db';
import { httpHandles } from '$lib/server/http';
import { isDatabaseUnavailable, noteDatabaseOutage } from '$lib/server/http/outage';
import { describeForLog, redact } from '$lib/server/http/redact';
import { limitPublicApi } from '$lib/server/limits/handle';
import { queueNames } from '$lib/server/jobs/names';
import { startJobs, stopJobs } from '$lib/server/jobs/runner';
import * as commissions from '$lib/server/commissions';
import * as fittings from '$lib/server/fittings';
import * as mail from '$lib/server/mail';
import * as orders from '$lib/server/orders';
import * as payments from '$lib/server/payments';
import * as quotes from '$lib/server/quotes';
import * as messages from '$lib/server/messages';
import * as search from '$lib/server/search';
import { requestSync } from '$lib/server/search-outbox';

/** Background jobs (mail and later ones) run in the app process; adapter-node's shutdown lets them finish. */
export const init: ServerInit = async () => {
	if (building) return; // prerendering public pages needs no database
	// A kept API answer counts against the same per-address limit as one the app renders.
	openFrontDoor({ allowApi: async (address) => (await publicApi({ address })).allowed });
	process.once('sveltekit:shutdown', () => void stopJobs());
	// Quotes create orders, so orders cannot import quotes: cancelling an unpaid order is wired to them here.
	orders.onUnpaidCancelled(quotes.reopenAfterCancelledOrder);
	await startJobs({
		[queueNames.mail]: mail.deliver,
		[queueNames.commissionExpiry]: async () => void (await commissions.expireDue(db)),
		[queueNames.quoteLapse]: async () => void (await quotes.lapseDue(db)),
		[queueNames.messageDigest]: async () => void (await messages.sendDigests(db)),
		[queueNames.searchSync]: async () => void (await search.syncOutbox(db)),
		[queueNames.orderRelease]: (data: { orderId: string }) => payments.runRelease(db, data),
		[queueNames.orderRefund]: (data: { orderId: string }) => payments.runRefund(db, data),
		[queueNames.orderAdvance]: (data: { orderId: string }) => payments.runAdvance(db, data),
		[queueNames.orderAutoRelease]: async () => void (await orders.releaseDue(db)),
		[queueNames.fittingReminder]: async () => void (await fittings.sendDueReminders(db))
	});
	void mail.relayStatus(); // warm the health check's cache
	// A search engine that lost its data (or a first start) is rebuilt by the first sync run.
	await requestSync(db).catch((error: unknown) => console.error(`[search] could not ask for a sync: ${String(error)}`));
};

/**
 * Besides the scripts and styles SvelteKit preloads by default, the latin Poppins weights every page sets text
 * in. The stylesheet names them, but the browser asks for a font only once it lays text out, behind the page's
 * scripts: text drawn in the fallback font then moves when Poppins arrives (a layout shift on a first visit).
 * Preloaded, they are requested ahead of the scripts. Bold (700) is rare and the other scripts' faces unused.
 */
const preloadedFont = /\/poppins-latin-[456]00-normal\.[\w-]+\.woff2$/;
const preload: ResolveOptions['preload'] = ({ type, path }) =>
	type === 'js' || type === 'css' || (type === 'font' && preloadedFont.test(path));

/** Routes hand this to domain functions; tests and scripts pass their own handle. */
const provideDb: Handle = ({ event, resolve }) => {
	event.locals.db = db;
	return resolve(event, { preload });
};

// Keepable answers carry what server/private-answers.js needs to send them again while nothing has changed.
const keepAnswers = markKeepableAnswers({ enabled: !dev && !building, sessionCookie: sessionCookieName });

export const handle = sequence(httpHandles, provideDb, limitPublicApi, authEndpoints, keepAnswers, loadUser, gateAreas);

const clientErrors: Record<number, App.Error> = {
	404: { message: 'There is nothing at this address.', code: 'not_found' },
	405: { message: 'This address does not answer that method.', code: 'method_not_allowed' },
	413: { message: 'The request is larger than this address accepts.', code: 'too_large' },
	415: {
		message: 'This address takes web forms (URL-encoded or multipart); the request was sent another way.',
		code: 'unsupported_media_type'
	}
};

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
	// 4xx raised by SvelteKit itself: an unknown address or action, a body it will not read.
	return clientErrors[status] ?? { message, code: 'bad_request' };
};
