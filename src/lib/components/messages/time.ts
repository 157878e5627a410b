/** When a message was sent, in the reader's time zone: the time today, the date and time before. */
export function formatWhen(iso: string, timeZone: string, now = new Date()) {
	const at = new Date(iso);
	const day = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone, dateStyle: 'short' }).format(d);
	const time = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit' }).format(at);
	if (day(at) === day(now)) return time;
	const sameYear = day(at).slice(0, 4) === day(now).slice(0, 4);
	const date = new Intl.DateTimeFormat('en-GB', {
		timeZone,
		day: 'numeric',
		month: 'short',
		...(sameYear ? {} : { year: 'numeric' })
	}).format(at);
	return `${date}, ${time}`;
}

/** The full date and time, for a `title` or screen readers. */
export function formatFull(iso: string, timeZone: string) {
	return new Intl.DateTimeFormat('en-GB', { timeZone, dateStyle: 'full', timeStyle: 'short' }).format(new Date(iso));
}
