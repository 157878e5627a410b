import { formatDate, formatMoney } from '$lib/format';
import { publicOrigin } from '../auth/origin';
import type { Mail } from '../mail';

type About = { commissionId: string; title: string };

const link = (commissionId: string) => `${publicOrigin()}/commissions/${commissionId}`;

/** To the tailor whose quote the customer turned down, with the reason when one was given. */
export function declinedMail(to: string, about: About & { reason: string }): Mail {
	const reason = about.reason ? `\n\nTheir reason:\n${about.reason}` : '\n\nThey gave no reason.';
	return {
		to,
		subject: `Your quote for “${about.title}” was declined`,
		text: `Hello,\n\nThe customer has declined your quote for “${about.title}”.${reason}\n\nIf the commission is still open you may send a new quote:\n${link(about.commissionId)}\n\n— Tackline`
	};
}

/** To each tailor whose quote lapsed because the customer accepted someone else's. */
export function anotherAcceptedMail(to: string, about: About): Mail {
	return {
		to,
		subject: `“${about.title}” went to another workroom`,
		text: `Hello,\n\nThe customer has accepted another quote for “${about.title}”, so yours is closed. Thank you for quoting; nothing more is needed from you.\n\n${link(about.commissionId)}\n\n— Tackline`
	};
}

/** To the tailor whose quote was accepted: the order, the amounts and what happens next. */
export function acceptedMail(
	to: string,
	about: About & {
		priceMinor: number;
		platformFeeMinor: number;
		tailorPayoutMinor: number;
		currency: string;
		dueDate: string;
	}
): Mail {
	const money = (amount: number) => formatMoney(amount, about.currency);
	return {
		to,
		subject: `Your quote for “${about.title}” was accepted`,
		text: `Hello,\n\nThe customer has accepted your quote for “${about.title}”.\n\nPrice: ${money(about.priceMinor)}\nTackline's fee: ${money(about.platformFeeMinor)}\nYour payout: ${money(about.tailorPayoutMinor)}\nDue: ${formatDate(about.dueDate)}\n\nThe order now waits for the customer's payment; we will tell you when it is paid, and you can start then. The full measurements and the cutting draft are on the commission page:\n${link(about.commissionId)}\n\n— Tackline`
	};
}
