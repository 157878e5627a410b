import { apiError } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

/** Any address under /api that no endpoint claims answers the JSON error shape, whatever the method. */
export const fallback: RequestHandler = () =>
	apiError(404, 'not_found', 'There is no endpoint at this address. The API lives under /api/v1/.');
