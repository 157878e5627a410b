import { mailer } from '../services/mailer';

export type RelayStatus = { ok: boolean; error: string | null; checkedAt: Date };

/** How long one answer from the relay stands before the next check opens a connection again. */
const FRESH_MS = 30_000;
let last: RelayStatus | null = null;
let checking: Promise<RelayStatus> | null = null;

function verify(): Promise<RelayStatus> {
	checking ??= Promise.resolve()
		.then(() => mailer().verify())
		.then(
			() => ({ ok: true, error: null }),
			(error: unknown) => ({ ok: false, error: error instanceof Error ? error.message : 'unreachable' })
		)
		.then((result) => {
			last = { ...result, checkedAt: new Date() };
			checking = null;
			return last;
		});
	return checking;
}

/**
 * Whether the SMTP relay answers, without opening a connection on every call: the last answer is
 * served while a stale one is refreshed in the background, one check at a time. Only the very first
 * call waits (bounded by the transport's timeouts).
 */
export async function relayStatus(): Promise<RelayStatus> {
	if (!last) return verify();
	if (Date.now() - last.checkedAt.getTime() > FRESH_MS) void verify();
	return last;
}

/** A mail just went through: the relay is answering, whatever the last check said. */
export function noteRelayAnswered() {
	last = { ok: true, error: null, checkedAt: new Date() };
}

/** nodemailer's codes for a relay that could not be reached or stopped answering (not a refused recipient). */
const unreachable = new Set(['ECONNECTION', 'ESOCKET', 'ETIMEDOUT', 'EDNS']);

/** A send failed: when the relay itself was unreachable, health says so before the next check. */
export function noteRelayFailed(error: unknown) {
	const code = (error as { code?: unknown } | null)?.code;
	if (typeof code !== 'string' || !unreachable.has(code)) return;
	console.warn(`[mail] the relay did not answer (${code}); the mail will be retried`);
	last = { ok: false, error: error instanceof Error ? error.message : code, checkedAt: new Date() };
}
