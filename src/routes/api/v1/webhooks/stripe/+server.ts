import { json } from '@sveltejs/kit';
import * as payments from '$lib/server/payments';
import { apiError } from '$lib/server/http/respond';
import { verifyEvent } from './verify.server';
import type { RequestHandler } from './$types';

/**
 * The payment processor's events. The raw body is verified against the endpoint's signing secret (a bad
 * signature or a timestamp more than five minutes old is 400 and changes nothing); a verified event is
 * applied once, and replays, duplicates and types we do not use are acknowledged with 200.
 */
export const POST: RequestHandler = async ({ request, locals }) => {
	const verified = await verifyEvent(request);
	if (!verified.ok) return apiError(400, 'invalid_signature', verified.message);
	const outcome = await payments.handleEvent(locals.db, verified.event);
	return json({ received: true, outcome });
};
