import { formatDate, formatMoney } from '$lib/format';
import type { Notice } from '../notifications';

/* What tailors are told when a customer decides on their quote: notices, so each is a mail and an in-app notice. */

type About = { commissionId: string; title: string };

const commissionPath = (commissionId: string) => `/commissions/${commissionId}`;

/** To the tailor whose quote the customer turned down, with the reason when one was given. */
export function declinedNotice(tailorId: string, about: About & { reason: string }): Notice {
	const reason = about.reason ? `\n\nTheir reason:\n${about.reason}` : '\n\nThey gave no reason.';
	return {
		userId: tailorId,
		event: 'quote_declined',
		title: `Your quote for “${about.title}” was declined`,
		body: `The customer has declined your quote for “${about.title}”.${reason}\n\nIf the commission is still open you may send a new quote:`,
		href: commissionPath(about.commissionId)
	};
}

/** To each tailor whose quote lapsed because the customer accepted someone else's. */
export function anotherAcceptedNotice(tailorId: string, about: About): Notice {
	return {
		userId: tailorId,
		event: 'quote_declined',
		title: `“${about.title}” went to another workroom`,
		body: `The customer has accepted another quote for “${about.title}”, so yours is closed. Thank you for quoting; nothing more is needed from you.`,
		href: commissionPath(about.commissionId)
	};
}

/** To the tailor whose quote was accepted: the order, the amounts and what happens next. */
export function acceptedNotice(
	tailorId: string,
	about: About & {
		priceMinor: number;
		platformFeeMinor: number;
		tailorPayoutMinor: number;
		currency: string;
		dueDate: string;
	}
): Notice {
	const money = (amount: number) => formatMoney(amount, about.currency);
	return {
		userId: tailorId,
		event: 'quote_accepted',
		title: `Your quote for “${about.title}” was accepted`,
		body: `The customer has accepted your quote for “${about.title}”.\n\nPrice: ${money(about.priceMinor)}\nTackline's fee: ${money(about.platformFeeMinor)}\nYour payout: ${money(about.tailorPayoutMinor)}\nDue: ${formatDate(about.dueDate)}\n\nThe order now waits for the customer's payment; we will tell you when it is paid, and you can start then. The full measurements and the cutting draft are on the commission page:`,
		href: commissionPath(about.commissionId)
	};
}
