import { formatDate, formatMoney } from '$lib/format';
import { publicOrigin } from '../auth/origin';
import type { Quote } from '../db/schema';
import type { Mail } from '../mail';
import type { Notice } from '../notifications';

type About = { title: string; id: string };

function greet(name: string | null | undefined) {
	const first = name?.trim().split(/\s+/)[0];
	return `Hello${first ? ` ${first}` : ''},`;
}

function terms(q: Quote) {
	return [
		`Price: ${formatMoney(q.priceMinor, q.currency)}${q.fabricIncluded ? ', fabric included' : ', fabric not included'}`,
		`Delivery by: ${formatDate(q.deliveryDate)}`,
		`Fittings included: ${q.fittingsIncluded}`,
		`Valid until: ${formatDate(q.validUntil.toISOString().slice(0, 10))}`
	]
		.map((line) => `• ${line}`)
		.join('\n');
}

const link = (c: About) => `${publicOrigin()}/commissions/${c.id}`;

/** To the customer: a new quote on their commission (a notice: mail and in-app). The tailor's note stays on the page. */
export function quoteSentNotice(customerId: string, c: About, workroom: string, q: Quote): Notice {
	return {
		userId: customerId,
		event: 'quote_received',
		title: `A new quote for “${c.title}” from ${workroom}`,
		body: `${workroom} has sent a quote for your commission “${c.title}”:\n\n${terms(q)}${q.message ? '\n\nThey added a note to the quote; read it on the commission’s page.' : ''}\n\nCompare it with the others and accept the one you want on the commission's page:`,
		href: `/commissions/${c.id}`
	};
}

/** To the customer: a quote they have not answered yet was changed. */
export function quoteEditedMail(to: string, name: string | null, c: About, workroom: string, q: Quote): Mail {
	return {
		to,
		subject: `${workroom} changed their quote for “${c.title}”`,
		text: `${greet(name)}\n\n${workroom} has changed the quote they sent for “${c.title}”. It now reads:\n\n${terms(q)}\n\n${link(c)}\n\n— Tackline`
	};
}

/** To the customer: a quote was taken back before they answered. */
export function quoteWithdrawnMail(to: string, name: string | null, c: About, workroom: string): Mail {
	return {
		to,
		subject: `${workroom} withdrew their quote for “${c.title}”`,
		text: `${greet(name)}\n\n${workroom} has withdrawn the quote they sent for “${c.title}”, so it can no longer be accepted. Other quotes are not affected.\n\n${link(c)}\n\n— Tackline`
	};
}

/** To the tailor: their quote passed its valid-until date unanswered. */
export function quoteLapsedMail(to: string, c: About, q: Quote): Mail {
	return {
		to,
		subject: `Your quote for “${c.title}” has lapsed`,
		text: `Hello,\n\nYour quote of ${formatMoney(q.priceMinor, q.currency)} for “${c.title}” was valid until ${formatDate(q.validUntil.toISOString().slice(0, 10))} and the customer did not answer in that time, so it has lapsed. If the commission is still open you can send a new quote:\n\n${link(c)}/quote\n\n— Tackline`
	};
}
