import { sequence } from '@sveltejs/kit/hooks';
import { apiErrorShape } from './api-errors';
import { databaseOutage } from './outage';
import { securityHeaders } from './security-headers';

/** The outermost handles: protective headers, the JSON error shape under /api, and 503s while the database is down. */
export const httpHandles = sequence(securityHeaders, apiErrorShape, databaseOutage);
