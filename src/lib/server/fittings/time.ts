import { DateTime } from 'luxon';

const wallClock = "yyyy-MM-dd'T'HH:mm";

/**
 * A wall-clock start (`2026-12-10T14:30`) read in an IANA zone: the instant, or why it cannot be one — a time
 * skipped when the clocks go forward does not exist there. A time that happens twice when they go back is read
 * as the first of the two.
 */
export function instantIn(local: string, zone: string): { ok: true; at: Date } | { ok: false; message: string } {
	const at = DateTime.fromISO(local, { zone });
	if (!at.isValid) return { ok: false, message: 'That date or time does not exist.' };
	if (at.toFormat(wallClock) !== local)
		return {
			ok: false,
			message: `${local.replace('T', ' ')} does not happen in ${zoneLabel(zone)}: the clocks go forward then. Choose another time.`
		};
	return { ok: true, at: at.toJSDate() };
}

/** The wall-clock form of an instant in a zone, as the offer form and `localStart` show it. */
export function wallClockIn(at: Date, zone: string) {
	return DateTime.fromJSDate(at, { zone }).toFormat(wallClock);
}

/** "Europe/London" → "Europe/London"; "America/New_York" → "America/New York". */
export function zoneLabel(zone: string) {
	return zone.replaceAll('_', ' ');
}

/**
 * One time range for people, in one zone, with the zone named: "Thu 10 Dec 2026, 14:30–15:15 GMT (Europe/London)".
 * A range that ends on another day names both days.
 */
export function describeRange(start: Date, end: Date, zone: string) {
	const from = DateTime.fromJSDate(start, { zone }).setLocale('en-GB');
	const to = DateTime.fromJSDate(end, { zone }).setLocale('en-GB');
	const sameDay = from.hasSame(to, 'day');
	const tail = sameDay ? to.toFormat('HH:mm') : to.toFormat('ccc d LLL, HH:mm');
	return `${from.toFormat('ccc d LLL yyyy, HH:mm')}–${tail} ${from.offsetNameShort ?? ''} (${zoneLabel(zone)})`.replace(
		'  ',
		' '
	);
}

/** A short heading form: "Thu 10 Dec, 14:30" in the zone. */
export function shortStart(start: Date, zone: string) {
	return DateTime.fromJSDate(start, { zone }).setLocale('en-GB').toFormat('ccc d LLL, HH:mm');
}

export function minutesBetween(start: Date, end: Date) {
	return Math.round((end.getTime() - start.getTime()) / 60_000);
}
