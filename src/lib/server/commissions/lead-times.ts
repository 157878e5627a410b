import type { GarmentId } from '$lib/drafting';

/**
 * Days a made-to-measure piece usually takes from order to handover, fittings included: common practice
 * among small workrooms (from memory), used only to warn a customer whose date is tighter.
 */
export const typicalLeadDays: Record<GarmentId | 'other', number> = {
	'wide-leg-trousers': 21,
	'cropped-top': 14,
	'straight-skirt': 14,
	'a-line-skirt': 14,
	'shift-dress': 21,
	tunic: 14,
	shirt: 21,
	waistcoat: 28,
	other: 28
};

/** Whole days from `today` to `date`, both `YYYY-MM-DD`. */
export function daysBetween(today: string, date: string) {
	return Math.round((Date.parse(`${date}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
}

/** Today's calendar date where the customer is. */
/** Day formatters by time zone: building one costs far more than formatting with it. */
const dayFormats = new Map<string, Intl.DateTimeFormat>();

export function todayIn(timeZone: string, now = new Date()) {
	try {
		let format = dayFormats.get(timeZone);
		if (!format) {
			format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
			if (dayFormats.size < 1024) dayFormats.set(timeZone, format);
		}
		return format.format(now);
	} catch {
		return now.toISOString().slice(0, 10);
	}
}

/** A warning (never an error) when the date leaves less than the usual time for the garment. */
export function leadTimeWarning(garment: string, dateNeeded: string, today: string): string | null {
	const typical = typicalLeadDays[garment as GarmentId | 'other'] ?? typicalLeadDays.other;
	const days = daysBetween(today, dateNeeded);
	if (days >= typical) return null;
	return `That is ${days} ${days === 1 ? 'day' : 'days'} away; tailors usually need about ${typical} days for this garment, fittings included. Some may still take it on, or ask for more time.`;
}
