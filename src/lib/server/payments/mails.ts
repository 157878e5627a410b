import { formatDate, formatMoney } from '$lib/format';
import { publicOrigin } from '../auth/origin';
import type { Mail } from '../mail';

type Paid = { orderId: string; commissionId: string; title: string; priceMinor: number; currency: string };

/** To the customer: their payment arrived and is held until they confirm delivery. */
export function paymentReceivedMail(to: string, paid: Paid): Mail {
	const amount = formatMoney(paid.priceMinor, paid.currency);
	return {
		to,
		subject: `Payment received for “${paid.title}”`,
		text: `Hello,\n\nWe have received your payment of ${amount} for “${paid.title}”. Tackline holds it and pays your tailor only when you confirm the garment was delivered.\n\nYour tailor has been told they can start. Follow the order here:\n${publicOrigin()}/commissions/${paid.commissionId}\n\n— Tackline`
	};
}

/** To the tailor: the customer has paid, so work can start. */
export function orderFundedMail(to: string, paid: Paid & { tailorPayoutMinor: number; dueDate: string }): Mail {
	return {
		to,
		subject: `“${paid.title}” is paid — you can start`,
		text: `Hello,\n\nThe customer has paid ${formatMoney(paid.priceMinor, paid.currency)} for “${paid.title}”. Tackline holds the money and transfers your payout of ${formatMoney(paid.tailorPayoutMinor, paid.currency)} when the customer confirms delivery.\n\nThe garment is due ${formatDate(paid.dueDate)}. The measurements and cutting draft are on the commission page:\n${publicOrigin()}/commissions/${paid.commissionId}\n\n— Tackline`
	};
}
