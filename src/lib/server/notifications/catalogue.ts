import type { NotificationChannel, NotificationEvent, UserRole } from '../db/schema';
import type { NoticeGroupId } from '$lib/types/notifications';

export type NoticeGroup = NoticeGroupId;

/** Why an event cannot be turned off: it moves money, or it is about meeting someone. */
export type Required = 'money' | 'meeting' | null;

export type EventInfo = {
	group: NoticeGroup;
	/** What the preferences page calls it. */
	label: string;
	/** One sentence: when it is sent. */
	description: string;
	/** Who can receive it; the preferences page shows a person only their own. */
	audience: readonly UserRole[];
	required: Required;
	/** The mail's button. */
	action: string;
};

const both = ['customer', 'tailor'] as const;

/** Every event Tackline tells people about, in the order the preferences page lists them. */
export const catalogue: Record<NotificationEvent, EventInfo> = {
	quote_received: {
		group: 'quotes',
		label: 'A quote arrives',
		description: 'A workroom sends a quote for one of your commissions.',
		audience: ['customer'],
		required: null,
		action: 'Compare quotes'
	},
	quote_accepted: {
		group: 'quotes',
		label: 'Your quote is accepted',
		description: 'A customer chooses your quote; the order then waits for their payment.',
		audience: ['tailor'],
		required: null,
		action: 'See the commission'
	},
	quote_declined: {
		group: 'quotes',
		label: 'Your quote is declined',
		description: 'A customer declines your quote, or chooses another workroom’s.',
		audience: ['tailor'],
		required: null,
		action: 'See the commission'
	},
	payment_received: {
		group: 'payments',
		label: 'Payment received',
		description: 'The customer’s payment arrives and Tackline holds it for the order.',
		audience: both,
		required: 'money',
		action: 'Follow the order'
	},
	payment_failed: {
		group: 'payments',
		label: 'Payment did not go through',
		description: 'A card payment for your order was declined.',
		audience: ['customer'],
		required: 'money',
		action: 'Try again'
	},
	advance_released: {
		group: 'payments',
		label: 'Fabric advance paid',
		description: 'The advance for materials is transferred to the workroom.',
		audience: both,
		required: 'money',
		action: 'See the order'
	},
	released: {
		group: 'payments',
		label: 'Payment released',
		description: 'The held payment is transferred to the workroom after delivery.',
		audience: both,
		required: 'money',
		action: 'See the order'
	},
	refunded: {
		group: 'payments',
		label: 'Refund',
		description: 'Money held for an order goes back to the customer.',
		audience: both,
		required: 'money',
		action: 'See the order'
	},
	order_cancelled: {
		group: 'payments',
		label: 'Order cancelled',
		description: 'An order is called off, and what happens to its money.',
		audience: both,
		required: 'money',
		action: 'See the order'
	},
	progress_posted: {
		group: 'work',
		label: 'Progress on your garment',
		description: 'Your tailor posts a step: fabric bought, pattern drafted, cut, sewing, finishing.',
		audience: ['customer'],
		required: null,
		action: 'See the progress'
	},
	fabric_approval: {
		group: 'work',
		label: 'Fabric to approve',
		description: 'A photo of the fabric waits for the customer’s approval, or the customer approved it.',
		audience: both,
		required: null,
		action: 'See the fabric'
	},
	delivered: {
		group: 'work',
		label: 'Garment delivered',
		description: 'The workroom marks the garment delivered or ready to collect.',
		audience: ['customer'],
		required: null,
		action: 'Confirm delivery'
	},
	alteration_requested: {
		group: 'work',
		label: 'Alteration asked for',
		description: 'The customer asks for a change after delivery.',
		audience: ['tailor'],
		required: null,
		action: 'See the request'
	},
	fitting_offered: {
		group: 'fittings',
		label: 'Fitting times offered',
		description: 'Your tailor offers times for a fitting.',
		audience: ['customer'],
		required: null,
		action: 'Choose a time'
	},
	fitting_booked: {
		group: 'fittings',
		label: 'Fitting booked or moved',
		description: 'A fitting is booked or moved, with a calendar file attached.',
		audience: both,
		required: 'meeting',
		action: 'See the fitting'
	},
	fitting_cancelled: {
		group: 'fittings',
		label: 'Fitting cancelled',
		description: 'A booked fitting is called off.',
		audience: both,
		required: 'meeting',
		action: 'See the order'
	},
	fitting_reminder: {
		group: 'fittings',
		label: 'Fitting tomorrow',
		description: 'A reminder the day before a booked fitting.',
		audience: both,
		required: null,
		action: 'See the fitting'
	},
	message_waiting: {
		group: 'messages',
		label: 'Messages waiting',
		description: 'Messages have waited unread for a while. One mail covers them all; the text stays on Tackline.',
		audience: both,
		required: null,
		action: 'Read your messages'
	},
	money_stuck: {
		group: 'desk',
		label: 'A payment needs a person',
		description: 'A payout or refund kept failing after every retry.',
		audience: ['admin'],
		required: 'money',
		action: 'Open the desk'
	}
};

export const groups: { id: NoticeGroup; title: string; description: string }[] = [
	{ id: 'quotes', title: 'Quotes', description: 'Quotes sent, accepted and declined.' },
	{
		id: 'payments',
		title: 'Payments',
		description: 'Mail about money is always sent: it is your record of what was paid, held, refunded or released.'
	},
	{ id: 'work', title: 'Work on an order', description: 'From the first cut to delivery.' },
	{
		id: 'fittings',
		title: 'Fittings',
		description:
			'Bookings and cancellations are always sent, so that nobody waits at a fitting that was moved or called off.'
	},
	{ id: 'messages', title: 'Messages', description: 'We never put a message’s text in a mail.' },
	{ id: 'desk', title: 'The desk', description: 'For administrators.' }
];

export const notificationEvents = Object.keys(catalogue) as NotificationEvent[];
export const channels: readonly NotificationChannel[] = ['email', 'in_app'];

/** The events a person of this role can receive; administrators see everything. */
export function eventsFor(role: UserRole): NotificationEvent[] {
	return notificationEvents.filter((event) => role === 'admin' || catalogue[event].audience.includes(role));
}

/** Whether this event may reach this role at all (`money_stuck` reaches administrators only). */
export function reaches(event: NotificationEvent, role: UserRole) {
	return event !== 'money_stuck' || role === 'admin';
}
