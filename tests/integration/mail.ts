/** The mail stand-in's relay switch, the queue's record of each mail, and bounded polling. */
import { testDb } from './db';

const inbox = process.env.MAIL_INBOX_URL;

/** Polls until `check` returns something truthy; fails after `timeoutMs` (a bound, not a timing assertion). */
export async function eventually<T>(
	check: () => Promise<T | null | undefined | false>,
	timeoutMs = 25_000
): Promise<T> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const value = await check();
		if (value) return value;
		if (Date.now() > deadline) throw new Error(`condition not met within ${timeoutMs / 1000} s`);
		await new Promise((resolve) => setTimeout(resolve, 200));
	}
}

/** `down` refuses connections; `stalled` accepts them and never answers. */
export async function setRelay(mode: 'up' | 'down' | 'stalled') {
	const response = await fetch(`${inbox}/control/relay`, { method: 'POST', body: JSON.stringify({ mode }) });
	if (!response.ok) throw new Error(`the mail stand-in refused mode ${mode}`);
}

/** The queue's record of mail to one address: `created`, `retry`, `active`, `completed` or `failed`. */
export async function mailJobs(address: string, queue = 'mail-send') {
	const { pool } = sharedDb();
	const { rows } = await pool.query<{ id: string; state: string; retryCount: number }>(
		`select id, state, retry_count as "retryCount" from pgboss.job where name = $1 and data->>'to' = $2`,
		[queue, address]
	);
	return rows;
}

let shared: ReturnType<typeof testDb> | null = null;
function sharedDb() {
	shared ??= testDb();
	return shared;
}

export async function closeMailDb() {
	await shared?.pool.end();
	shared = null;
}
