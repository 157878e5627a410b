import { formatDate, formatMoney } from '$lib/format';
import type { Notice } from '../notifications';

type Paid = { orderId: string; commissionId: string; title: string; priceMinor: number; currency: string };

/** To the customer: their payment arrived and is held until they confirm delivery. */
export function paymentReceivedNotice(customerId: string, paid: Paid): Notice {
	const amount = formatMoney(paid.priceMinor, paid.currency);
	return {
		userId: customerId,
		event: 'payment_received',
		title: `Payment received for “${paid.title}”`,
		body: `We have received your payment of ${amount} for “${paid.title}”. Tackline holds it and pays your tailor only when you confirm the garment was delivered.\n\nYour tailor has been told they can start. Follow the order here:`,
		href: `/orders/${paid.orderId}`
	};
}

/** To the tailor: the customer has paid, so work can start. */
export function orderFundedNotice(
	tailorId: string,
	paid: Paid & { tailorPayoutMinor: number; dueDate: string }
): Notice {
	return {
		userId: tailorId,
		event: 'payment_received',
		title: `“${paid.title}” is paid — you can start`,
		body: `The customer has paid ${formatMoney(paid.priceMinor, paid.currency)} for “${paid.title}”. Tackline holds the money and transfers your payout of ${formatMoney(paid.tailorPayoutMinor, paid.currency)} when the customer confirms delivery.\n\nThe garment is due ${formatDate(paid.dueDate)}. Post your progress, offer fitting times and find the measurements and cutting draft on the order page:`,
		href: `/orders/${paid.orderId}`
	};
}
