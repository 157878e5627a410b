import type Stripe from 'stripe';
import { kilobytes } from '$lib/server/http/body';
import { verifyProcessorEvent } from '$lib/server/payments/verify';

/** Processor events are small; anything larger is not one. */
const maxBytes = kilobytes(256);

/** Reads the raw body (bounded) and verifies its signature header. */
export async function verifyEvent(
	request: Request
): Promise<{ ok: true; event: Stripe.Event } | { ok: false; message: string }> {
	const declared = Number(request.headers.get('content-length') ?? 0);
	if (declared > maxBytes) return { ok: false, message: 'The event is larger than any event we accept.' };
	const raw = await request.text();
	if (raw.length > maxBytes) return { ok: false, message: 'The event is larger than any event we accept.' };
	const header = request.headers.get('stripe-signature');
	if (!header) return { ok: false, message: 'The Stripe-Signature header is missing.' };
	return verifyProcessorEvent(raw, header);
}
