import type { OrderStatus } from '$lib/types/order';
import type { BoardColumn, OrderAudience, PaymentHistoryItem, ProgressStepKind } from '$lib/types/order-page';

/** The tones Badge.svelte draws. */
type Tone = 'neutral' | 'info' | 'success' | 'warning' | 'danger';

/** Short names of the order's states, for badges and lists. */
export const orderStatusLabels: Record<OrderStatus, { label: string; tone: Tone }> = {
	awaiting_payment: { label: 'Awaiting payment', tone: 'warning' },
	funded: { label: 'Paid, not started', tone: 'info' },
	in_work: { label: 'In work', tone: 'info' },
	ready: { label: 'Ready', tone: 'success' },
	delivered: { label: 'Delivered', tone: 'success' },
	released: { label: 'Paid out (released)', tone: 'success' },
	cancelled: { label: 'Cancelled', tone: 'neutral' },
	refunded: { label: 'Refunded', tone: 'neutral' },
	disputed: { label: 'In dispute', tone: 'danger' },
	settled: { label: 'Settled', tone: 'neutral' }
};

export function orderStatusOf(status: OrderStatus) {
	return orderStatusLabels[status];
}

type Facts = {
	status: OrderStatus;
	releaseRequested: boolean;
	refundRequested?: boolean;
	alterationRequested: boolean;
};

/**
 * The order's state in plain words and what happens next, for the person looking. One sentence each: the
 * page's headline and the lists' "next step".
 */
export function statusSentence(facts: Facts, audience: OrderAudience): { now: string; next: string } {
	const tailor = audience === 'tailor';
	const customer = audience === 'customer';
	if (facts.refundRequested && facts.status !== 'refunded')
		return {
			now: 'Cancelled by agreement — refund on its way',
			next: 'The whole payment goes back to the customer’s card; this page shows “refunded” when it has.'
		};
	switch (facts.status) {
		case 'awaiting_payment':
			return {
				now: 'Awaiting payment',
				next: customer
					? 'Pay to start the work: Tackline holds the money until you confirm delivery.'
					: 'The customer pays next; the work starts once the payment is in.'
			};
		case 'funded':
			return {
				now: 'Paid — held by Tackline until delivery is confirmed',
				next: tailor
					? 'Start the work and post your first progress step.'
					: 'The workroom starts next and posts its progress here.'
			};
		case 'in_work':
			return facts.alterationRequested
				? {
						now: 'Alteration asked for — the money stays held',
						next: tailor
							? 'Make the alteration, then mark the garment delivered again.'
							: 'The workroom is altering the garment and will deliver it again.'
					}
				: {
						now: 'In work — the money is held by Tackline',
						next: tailor
							? 'Post progress as you go and mark the garment ready when it is finished.'
							: 'Follow the progress here; fittings are offered on the fittings page.'
					};
		case 'ready':
			return {
				now: 'Ready — the money is held by Tackline',
				next: tailor
					? 'Hand it over (pickup or courier) and mark it delivered.'
					: 'The workroom hands it over next, at the workroom or by courier.'
			};
		case 'delivered':
			if (facts.releaseRequested)
				return {
					now: 'Delivery confirmed — paying the workroom',
					next: 'The payment to the workroom is on its way; this page shows “released” when it has gone through.'
				};
			if (facts.alterationRequested)
				return {
					now: 'Alteration asked for — the money stays held',
					next: tailor
						? 'Make the alteration, then mark the garment delivered again.'
						: 'The workroom will alter the garment and deliver it again.'
				};
			return {
				now: 'Delivered — held by Tackline until you confirm',
				next: customer
					? 'Confirm delivery to pay the workroom, or ask for an alteration.'
					: 'The customer confirms delivery next; otherwise payment is released automatically after the waiting period.'
			};
		case 'released':
			return { now: 'Released — the workroom has been paid', next: 'Nothing more to do. Thank you!' };
		case 'cancelled':
			return { now: 'Cancelled', next: 'Nothing was charged, or what was charged has been returned.' };
		case 'refunded':
			return { now: 'Refunded', next: 'The payment has gone back to the customer’s card.' };
		case 'disputed':
			return {
				now: 'In dispute — the money stays held',
				next: 'Tackline is looking into it and will write to you both.'
			};
		case 'settled':
			return { now: 'Settled', next: 'The dispute has been settled and the money split as decided.' };
	}
}

/** A tailor's progress steps as people read them. */
export const progressStepLabels: Record<ProgressStepKind, string> = {
	fabric_sourced: 'Fabric bought',
	pattern_drafted: 'Pattern drafted',
	cutting: 'Cut',
	first_fitting: 'First fitting',
	sewing: 'Sewing',
	final_fitting: 'Final fitting',
	finishing: 'Finishing',
	ready: 'Ready'
};

/** Payments and transfers as the order's timeline names them. */
export function paymentLine(item: PaymentHistoryItem, audience: OrderAudience): string {
	const failed = item.status === 'failed';
	const pending = item.status === 'pending';
	switch (item.kind) {
		case 'charge':
			if (failed) return 'A card payment did not go through';
			return audience === 'customer' ? 'You paid; Tackline holds the money' : 'The customer paid; Tackline holds it';
		case 'advance_transfer':
			return pending ? 'Materials advance being paid to the workroom' : 'Materials advance paid to the workroom';
		case 'release_transfer':
			return pending ? 'Payment to the workroom on its way' : 'Payment released to the workroom';
		case 'refund':
			return pending ? 'Refund on its way to the customer' : 'Refunded to the customer';
		case 'reversal':
			return 'Materials advance returned from the workroom';
	}
}

/** Status changes from the order's history; null for those the timeline shows another way (or not at all). */
const statusLines: Record<string, string | null> = {
	'order.created': 'Quote accepted — order made',
	'order.checkout_started': null,
	'order.funded': null,
	'order.payment_failed': null,
	'order.payment_mismatch': null,
	'order.progress_posted': null,
	'order.ready': 'Marked ready',
	'order.delivered': 'Marked delivered',
	'order.redelivered': 'Delivered again after the alteration',
	'order.alteration_requested': 'Alteration asked for',
	'order.delivery_confirmed': 'Delivery confirmed',
	'order.auto_release': 'Released automatically after the waiting period',
	'order.released': 'Released to the workroom',
	'order.cancelled': 'Order cancelled',
	'order.cancellation_requested': 'Cancellation asked for',
	'order.cancellation_agreed': 'Cancellation agreed',
	'order.cancellation_declined': 'Cancellation declined',
	'order.refunded': null,
	'order.late_payment': 'A payment arrived after the order was cancelled',
	'order.late_payment_refunded': null,
	'order.fabric_approved': 'Fabric approved',
	'order.advance_paid': null,
	'order.money_call_failed': null,
	'order.money_stuck': null
};

/** The timeline's words for a recorded action, or null to leave it out. */
export function statusLine(action: string): string | null {
	if (action in statusLines) return statusLines[action];
	if (!action.startsWith('order.')) return null;
	const words = action.slice('order.'.length).replaceAll('_', ' ');
	return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The board's columns as the workroom reads them. */
export const boardColumnLabels: Record<BoardColumn, { title: string; hint: string }> = {
	to_start: { title: 'To start', hint: 'Paid or awaiting payment; no progress posted yet.' },
	in_work: { title: 'In work', hint: 'Progress posted; not yet ready.' },
	ready: { title: 'Ready', hint: 'Finished, waiting to be handed over.' },
	delivered: { title: 'Delivered', hint: 'Handed over, awaiting the customer’s confirmation and release.' },
	finished: { title: 'Finished', hint: 'Released, cancelled, refunded or settled.' }
};
