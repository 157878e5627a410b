/**
 * Webhook delivery for the Stripe stand-in: every event goes to each configured endpoint as JSON,
 * signed as Stripe signs (`Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256(secret, "<t>.<body>")>`), and
 * is retried with exponential back-off while the endpoint answers anything but 2xx (or does not answer).
 * Faults on demand: a share of deliveries dropped, or delivered twice.
 */
import { createHmac } from 'node:crypto';
import type { StripeEvent } from './stripe-store';

export type WebhookEndpoint = {
	url: string;
	/** `whsec_…`, what the receiver passes to `stripe.webhooks.constructEvent`. */
	secret: string;
	/** Event types to send (`*` or absent: all). */
	events?: string[];
};

export type DeliveryAttempt = { at: string; status: number | null; error?: string };
export type Delivery = {
	eventId: string;
	type: string;
	url: string;
	/** `duplicate` marks the second copy sent by the duplicate-webhook fault. */
	copy: 'first' | 'duplicate' | 'resend';
	state: 'pending' | 'delivered' | 'failed' | 'dropped';
	attempts: DeliveryAttempt[];
};

export type WebhookFaults = { dropWebhooks: number; duplicateWebhooks: number };

export function signPayload(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
	const signature = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
	return `t=${timestamp},v1=${signature}`;
}

export type DispatcherOptions = {
	endpoints: WebhookEndpoint[];
	/** First retry after this long, doubling each time (Stripe spreads retries over days). */
	retryBaseMs?: number;
	retryMaxMs?: number;
	/** Attempts in all, the first included, before the delivery is marked failed. */
	maxAttempts?: number;
	/** How long one attempt may take. */
	attemptTimeoutMs?: number;
	faults: () => WebhookFaults;
	random?: () => number;
};

export class WebhookDispatcher {
	endpoints: WebhookEndpoint[];
	readonly deliveries: Delivery[] = [];
	private timers = new Set<NodeJS.Timeout>();
	private inFlight = 0;
	private waiters: (() => void)[] = [];
	private generation = 0;

	constructor(private options: DispatcherOptions) {
		this.endpoints = options.endpoints;
	}

	dispatch(event: StripeEvent, copy: Delivery['copy'] = 'first') {
		const faults = this.options.faults();
		const random = this.options.random ?? Math.random;
		for (const endpoint of this.endpoints) {
			if (endpoint.events && !endpoint.events.includes('*') && !endpoint.events.includes(event.type)) continue;
			const delivery: Delivery = {
				eventId: event.id,
				type: event.type,
				url: endpoint.url,
				copy,
				state: 'pending',
				attempts: []
			};
			this.deliveries.push(delivery);
			if (copy === 'first' && random() < faults.dropWebhooks) {
				delivery.state = 'dropped';
				continue;
			}
			event.pending_webhooks += 1;
			this.attempt(event, endpoint, delivery);
			if (copy === 'first' && random() < faults.duplicateWebhooks) {
				const twin: Delivery = { ...delivery, copy: 'duplicate', attempts: [] };
				this.deliveries.push(twin);
				this.attempt(event, endpoint, twin);
			}
		}
	}

	private attempt(event: StripeEvent, endpoint: WebhookEndpoint, delivery: Delivery) {
		const generation = this.generation;
		this.inFlight += 1;
		// Stripe signs every attempt afresh, so a retried delivery carries a current timestamp.
		const payload = JSON.stringify(event, null, 2);
		const attempt: DeliveryAttempt = { at: new Date().toISOString(), status: null };
		void fetch(endpoint.url, {
			method: 'POST',
			headers: {
				'content-type': 'application/json; charset=utf-8',
				'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
				'stripe-signature': signPayload(payload, endpoint.secret)
			},
			body: payload,
			signal: AbortSignal.timeout(this.options.attemptTimeoutMs ?? 10_000)
		})
			.then(async (response) => {
				attempt.status = response.status;
				await response.arrayBuffer().catch(() => undefined);
				return response.ok;
			})
			.catch((error: unknown) => {
				attempt.error =
					error instanceof Error ? (error.cause instanceof Error ? error.cause.message : error.message) : String(error);
				return false;
			})
			.then((ok) => {
				if (generation !== this.generation) return;
				delivery.attempts.push(attempt);
				if (ok) {
					delivery.state = 'delivered';
					event.pending_webhooks = Math.max(0, event.pending_webhooks - 1);
				} else if (delivery.attempts.length >= (this.options.maxAttempts ?? 8)) {
					delivery.state = 'failed';
					event.pending_webhooks = Math.max(0, event.pending_webhooks - 1);
				} else {
					const base = this.options.retryBaseMs ?? 1000;
					const delay = Math.min(base * 2 ** (delivery.attempts.length - 1), this.options.retryMaxMs ?? 60 * 60_000);
					this.inFlight += 1;
					const timer = setTimeout(() => {
						this.timers.delete(timer);
						this.inFlight -= 1;
						this.attempt(event, endpoint, delivery);
					}, delay);
					this.timers.add(timer);
				}
			})
			.finally(() => {
				this.inFlight -= 1;
				if (this.inFlight === 0) for (const resolve of this.waiters.splice(0)) resolve();
			});
	}

	/** Resolves once no delivery is in flight or waiting for a retry. */
	idle(): Promise<void> {
		if (this.inFlight === 0) return Promise.resolve();
		return new Promise((resolve) => this.waiters.push(resolve));
	}

	/** Forgets deliveries and cancels pending retries. */
	reset() {
		this.generation += 1;
		for (const timer of this.timers) clearTimeout(timer);
		this.inFlight -= this.timers.size;
		this.timers.clear();
		this.deliveries.length = 0;
		if (this.inFlight <= 0) {
			this.inFlight = 0;
			for (const resolve of this.waiters.splice(0)) resolve();
		}
	}
}
