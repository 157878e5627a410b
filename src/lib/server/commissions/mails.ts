import { formatDate, formatMoneyRange, garmentName } from '$lib/format';
import { publicOrigin } from '../auth/origin';
import type { Commission } from '../db/schema';
import type { Mail } from '../mail';

const fabricWords = {
	customer_supplies: 'the customer supplies the fabric',
	tailor_sources: 'the tailor sources the fabric'
};
const handoverWords = { pickup: 'collected from the workroom', delivery: 'delivered' };

function budgetText(c: Commission) {
	return c.budgetMinMinor === null || c.budgetMaxMinor === null
		? 'not given'
		: formatMoneyRange(c.budgetMinMinor, c.budgetMaxMinor, c.currency);
}

function placeText(c: Commission) {
	return [c.district, c.city].filter(Boolean).join(', ') || 'not given';
}

const quoted = (value: string) => (value ? `“${value}”` : '(empty)');

/** What changed between two versions of a commission, one plain sentence per field a tailor cares about. */
export function describeChanges(before: Commission, after: Commission): string[] {
	const lines: string[] = [];
	if (before.title !== after.title) lines.push(`Title: ${quoted(before.title)} is now ${quoted(after.title)}.`);
	if (before.styleNotes !== after.styleNotes) lines.push(`Style notes now read:\n${after.styleNotes || '(none)'}`);
	if (before.fabricSource !== after.fabricSource)
		lines.push(`Fabric: ${fabricWords[before.fabricSource]} — now ${fabricWords[after.fabricSource]}.`);
	if (before.fabricNotes !== after.fabricNotes) lines.push(`Fabric notes now read:\n${after.fabricNotes || '(none)'}`);
	if (budgetText(before) !== budgetText(after))
		lines.push(`Budget: was ${budgetText(before)}, now ${budgetText(after)}.`);
	if (before.dateNeeded !== after.dateNeeded)
		lines.push(
			`Needed by: was ${before.dateNeeded ? formatDate(before.dateNeeded) : 'not given'}, now ${after.dateNeeded ? formatDate(after.dateNeeded) : 'not given'}.`
		);
	if (placeText(before) !== placeText(after)) lines.push(`Area: was ${placeText(before)}, now ${placeText(after)}.`);
	if (before.handover !== after.handover)
		lines.push(`Handover: was to be ${handoverWords[before.handover]}, now ${handoverWords[after.handover]}.`);
	return lines;
}

function commissionUrl(c: Commission) {
	return `${publicOrigin()}/commissions/${c.id}`;
}

function what(c: Commission) {
	return c.garmentType === 'other' ? c.garmentOther : garmentName(c.garmentType).toLowerCase();
}

export function changedMail(to: string, c: Commission, lines: string[]): Mail {
	return {
		to,
		subject: `A commission you quoted on has changed: ${c.title}`,
		text: `Hello,\n\nThe customer has changed the commission “${c.title}” (${what(c)}) that you sent a quote for:\n\n${lines.map((l) => `• ${l}`).join('\n\n')}\n\nYour quote still stands as you sent it. If the change affects your price or your date, withdraw it and send a new one.\n\n${commissionUrl(c)}\n\n— Tackline`
	};
}

export function cancelledMail(to: string, c: Commission): Mail {
	return {
		to,
		subject: `A commission you quoted on was cancelled: ${c.title}`,
		text: `Hello,\n\nThe customer has cancelled the commission “${c.title}” (${what(c)}), so your quote on it will not be accepted. Thank you for quoting.\n\n— Tackline`
	};
}

export function expiredMail(to: string, name: string | null, c: Commission): Mail {
	const greeting = name?.trim().split(/\s+/)[0];
	return {
		to,
		subject: `Your commission has closed without a tailor: ${c.title}`,
		text: `Hello${greeting ? ` ${greeting}` : ''},\n\nYour commission “${c.title}” was open for quotes until ${c.expiresAt ? formatDate(c.expiresAt.toISOString().slice(0, 10)) : 'today'} and no quote was accepted in that time, so it has now closed. Nothing was paid.\n\nYou can post it again from your list of commissions: a new date or budget often brings more quotes.\n\n${publicOrigin()}/commissions\n\n— Tackline`
	};
}
