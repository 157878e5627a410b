import { env } from '$env/dynamic/private';

const defaultCutoffHours = 24;

/**
 * How long before a fitting the customer may still book, move or cancel it online, from
 * `FITTING_CHANGE_CUTOFF_HOURS` (default 24, a whole number from 0 to 168). Closer than that, they message the tailor.
 */
export function fittingChangeCutoffHours(): number {
	const raw = env.FITTING_CHANGE_CUTOFF_HOURS?.trim();
	if (!raw || !/^\d{1,3}$/.test(raw)) return defaultCutoffHours;
	const hours = Number(raw);
	return hours <= 168 ? hours : defaultCutoffHours;
}
