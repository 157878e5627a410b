import type { Handle } from '@sveltejs/kit';
import { apiErrorShape } from './api-errors';
import { databaseOutage } from './outage';
import { securityHeaders } from './security-headers';

/**
 * The outermost handles: protective headers, the JSON error shape under /api, and 503s while the database
 * is down — in that order, as `sequence(securityHeaders, apiErrorShape, databaseOutage)` would run them,
 * but nested by hand: none of them passes options to `resolve`, and each level of `sequence` costs every
 * request a tracing span, a copy of the event and an AsyncLocalStorage scope.
 */
export const httpHandles: Handle = ({ event, resolve }) =>
	securityHeaders({
		event,
		resolve: (outer, outerOptions) =>
			apiErrorShape({
				event: outer,
				resolve: (inner, innerOptions) =>
					databaseOutage({
						event: inner,
						resolve: (last, options) => resolve(last, options ?? innerOptions ?? outerOptions)
					})
			})
	});
