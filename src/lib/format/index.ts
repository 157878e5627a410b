// The names alone: the templates would bring every garment's drafting code into each page that names one.
import { garmentNames, isGarmentId } from '../drafting/garment-names';
import { utcOffset } from './time-zones';

const dateFormat = new Intl.DateTimeFormat('en-GB', {
	day: 'numeric',
	month: 'short',
	year: 'numeric',
	timeZone: 'UTC'
});

/** A calendar date stored as `YYYY-MM-DD`, shown the same wherever the viewer is. */
export function formatDate(isoDate: string) {
	return dateFormat.format(new Date(`${isoDate}T00:00:00Z`));
}

/** A moment in the viewer's own time zone, with its offset as the zone list shows it: "10 Jan 2027, 09:05 (UTC+00:00)". */
export function formatDateTime(at: Date, timeZone: string) {
	const local = new Intl.DateTimeFormat('en-GB', {
		day: 'numeric',
		month: 'short',
		year: 'numeric',
		hour: '2-digit',
		minute: '2-digit',
		timeZone
	}).format(at);
	return `${local} (${utcOffset(timeZone, at)})`;
}

export function garmentName(id: string) {
	return isGarmentId(id) ? garmentNames[id] : id.replace(/[_-]+/g, ' ');
}

export { formatMoney, formatMoneyAmong, formatMoneyRange } from './money';
export { formatSizeBand, type SizeBandRange } from './size-band';
