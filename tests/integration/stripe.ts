import { StripeStandinController } from '../../docker/standins/stripe-controller';
import type { StripeStandin } from '../../docker/standins/stripe';

let current: StripeStandin | null = null;

export function setStripeStandin(standin: StripeStandin) {
	current = standin;
}

/** This file's Stripe stand-in (its store, `stop()` and `start()`), shared with this file's server. */
export function stripeStandin(): StripeStandin {
	if (!current) throw new Error('No Stripe stand-in: only integration files with a server have one');
	return current;
}

/** Drives this file's Stripe stand-in: faults, events and deliveries, the hosted payment and onboarding pages. */
export function stripeControl(): StripeStandinController {
	return new StripeStandinController(stripeStandin().url);
}
