import { garments } from './drafting';

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

export function garmentName(id: string) {
	return garments.find((g) => g.id === id)?.name ?? id.replace(/[_-]+/g, ' ');
}

export { formatMoney } from './drafting/quote';
