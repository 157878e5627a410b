/** Error text for the server log, with what must never be logged taken out. */

const passwordHash = /\$(argon2(?:id|i|d)|2[abxy]?|scrypt|pbkdf2[\w-]*)\$[\w+/=.,$-]+/gi;
const emailAddress = /[\w.!#$%&'*+/=?^`{|}~-]+@[\w-]+(?:\.[\w-]+)+/g;
// Drizzle puts a failed query's parameters in the message: names, addresses, hashes, anything.
const queryParams = /(params:)[^\n]*/gi;
// PostgreSQL repeats the offending values in `detail`, e.g. "Key (email)=(a@b.test) already exists."
const keyDetail = /(Key \([^)]*\)=\()[^)]*(\))/g;

export function redact(text: string): string {
	return text
		.replace(queryParams, '$1 [redacted]')
		.replace(keyDetail, '$1[redacted]$2')
		.replace(passwordHash, '[password hash]')
		.replace(emailAddress, '[email]');
}

function describe(error: unknown, depth: number): string {
	if (!(error instanceof Error)) return String(error);
	const detail = (error as { detail?: unknown }).detail;
	let text = error.stack ?? `${error.name}: ${error.message}`;
	if (typeof detail === 'string') text += `\n  detail: ${detail}`;
	if (error.cause !== undefined && depth < 4) text += `\n  caused by: ${describe(error.cause, depth + 1)}`;
	return text;
}

/** The error with its stack and causes, as one redacted string fit for the log. */
export function describeForLog(error: unknown): string {
	return redact(describe(error, 0));
}
