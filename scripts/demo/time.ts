const day = 86_400_000;

export function daysFrom(now: Date, days: number): Date {
	return new Date(now.getTime() + days * day);
}

/** A calendar date (YYYY-MM-DD) the given number of days from now, for `date` columns. */
export function dateFrom(now: Date, days: number): string {
	return daysFrom(now, days).toISOString().slice(0, 10);
}
