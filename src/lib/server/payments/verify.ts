import type Stripe from 'stripe';
import { payments, webhookSecret } from '../services/payments';

/** How old a signed event may be, in seconds (Stripe's default tolerance); older ones may be replays. */
export const signatureToleranceSeconds = 300;

/**
 * Verifies a webhook's raw body against its `Stripe-Signature` header with the endpoint's signing secret:
 * the HMAC must match and the timestamp must be within the tolerance. Never throws for a bad request.
 */
export function verifyProcessorEvent(
	raw: string,
	header: string
): { ok: true; event: Stripe.Event } | { ok: false; message: string } {
	try {
		const event = payments().webhooks.constructEvent(raw, header, webhookSecret(), signatureToleranceSeconds);
		return { ok: true, event };
	} catch (error) {
		const name = (error as { type?: string }).type;
		if (name === 'StripeSignatureVerificationError')
			return { ok: false, message: (error as Error).message || 'The signature does not match.' };
		// constructEvent also throws on a body that is not JSON once the signature holds.
		if (error instanceof SyntaxError) return { ok: false, message: 'The event is not valid JSON.' };
		throw error;
	}
}
