/**
 * Drives the Stripe stand-in from tests over HTTP, as a person and an operator would: pays on the hosted
 * page, finishes onboarding, injects faults, reads events and their webhook deliveries. Works against a
 * stand-in in this process or another one (`npm start`, an integration file's server).
 */
import type { StripeFaults } from './stripe';
import type { StripeEvent } from './stripe-store';
import type { Delivery, WebhookEndpoint } from './stripe-webhooks';

export type EventWithDeliveries = StripeEvent & { deliveries: Delivery[] };
export type PageResult = { status: number; location: string | null; html: string };

export const TEST_CARDS = {
	success: '4242 4242 4242 4242',
	declined: '4000 0000 0000 0002',
	insufficientFunds: '4000 0000 0000 9995'
} as const;

export class StripeStandinController {
	constructor(readonly baseUrl: string) {}

	private async call<T>(method: string, path: string, body?: unknown): Promise<T> {
		const response = await fetch(`${this.baseUrl}/__standin${path}`, {
			method,
			headers: body === undefined ? {} : { 'content-type': 'application/json' },
			body: body === undefined ? undefined : JSON.stringify(body)
		});
		const json = (await response.json()) as T & { error?: { message: string } };
		if (!response.ok && response.status !== 504)
			throw new Error(`Stripe stand-in ${method} ${path}: ${json.error?.message ?? response.status}`);
		return json;
	}

	/** Replaces every fault setting; what is left out is off. */
	setFaults(faults: Partial<StripeFaults>) {
		return this.call<StripeFaults>('POST', '/faults', faults);
	}
	clearFaults() {
		return this.call<StripeFaults>('DELETE', '/faults');
	}
	/** Forgets every object, event, idempotency key and fault. */
	reset() {
		return this.call<{ reset: true }>('POST', '/reset');
	}
	async events(type?: string): Promise<EventWithDeliveries[]> {
		const query = type ? `?type=${encodeURIComponent(type)}` : '';
		return (await this.call<{ events: EventWithDeliveries[] }>('GET', `/events${query}`)).events;
	}
	resend(eventId: string) {
		return this.call<{ resent: string }>('POST', `/events/${encodeURIComponent(eventId)}/resend`);
	}
	/** True once no webhook delivery is in flight or waiting to be retried. */
	async idle(timeoutMs = 10_000): Promise<boolean> {
		return (await this.call<{ idle: boolean }>('GET', `/idle?timeoutMs=${timeoutMs}`)).idle;
	}
	setWebhooks(endpoints: WebhookEndpoint[]) {
		return this.call<{ endpoints: WebhookEndpoint[] }>('POST', '/webhooks', { endpoints });
	}
	/** Pending funds become available now. */
	settle() {
		return this.call<unknown>('POST', '/settle');
	}
	setAvailabilityDelay(seconds: number) {
		return this.call<unknown>('POST', '/settings', { availabilityDelaySeconds: seconds });
	}
	/** Waits until an event matching `match` has been created. */
	async waitForEvent(match: (event: EventWithDeliveries) => boolean, timeoutMs = 5000): Promise<EventWithDeliveries> {
		const deadline = Date.now() + timeoutMs;
		for (;;) {
			const found = (await this.events()).find(match);
			if (found) return found;
			if (Date.now() > deadline) throw new Error('No such event from the Stripe stand-in in time');
			await new Promise((resolve) => setTimeout(resolve, 50));
		}
	}

	/** Submits the hosted payment page of a Checkout Session (its `url`) with a card number. */
	async pay(checkoutUrl: string, card: string, fields: Record<string, string> = {}): Promise<PageResult> {
		const response = await fetch(checkoutUrl, {
			method: 'POST',
			headers: { 'content-type': 'application/x-www-form-urlencoded' },
			body: new URLSearchParams({ card, ...fields }),
			redirect: 'manual'
		});
		return { status: response.status, location: response.headers.get('location'), html: await response.text() };
	}

	/** Opens an account link (its `url`) and agrees, or saves for later; returns where Stripe sends the person next. */
	async onboard(linkUrl: string, { name = '', complete = true } = {}): Promise<PageResult> {
		const page = await fetch(linkUrl, { redirect: 'manual' });
		if (page.status !== 200)
			return { status: page.status, location: page.headers.get('location'), html: await page.text() };
		await page.arrayBuffer();
		const response = await fetch(linkUrl, {
			method: 'POST',
			headers: { 'content-type': 'application/x-www-form-urlencoded' },
			body: new URLSearchParams({ name, action: complete ? 'complete' : 'later' }),
			redirect: 'manual'
		});
		return { status: response.status, location: response.headers.get('location'), html: await response.text() };
	}
}
