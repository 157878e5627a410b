import { sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { jobsRunning } from '../jobs/runner';
import * as mail from '../mail';
import * as payments from '../services/payments';
import * as search from '../services/search';
import * as storage from '../services/storage';

export type HealthChecks = {
	database: 'ok' | 'down';
	mail: 'ok' | 'degraded';
	queue: 'ok' | 'down';
	storage: 'ok' | 'degraded';
	/** When search is down, lists come from PostgreSQL instead: slower, still right. */
	search: 'ok' | 'degraded';
	/** The payment processor (Stripe): paying and payouts wait while it cannot be reached. */
	payments: 'ok' | 'degraded';
};
export type HealthReport = {
	/** `down` when the database is: nothing works without it. `degraded` when mail, jobs, storage, search or payments wait. */
	status: 'ok' | 'degraded' | 'down';
	checks: HealthChecks;
	/** Internal error text, for administrators only. */
	details?: Record<string, string>;
};

async function database(db: Executor): Promise<string | null> {
	try {
		await db.execute(sql`select 1`);
		return null;
	} catch (error) {
		return error instanceof Error ? error.message : 'unreachable';
	}
}

/** Each hosted service adds its check here. The relay's answer is cached, so this is cheap to poll. */
export async function report(db: Executor, { withDetails = false } = {}): Promise<HealthReport> {
	const [databaseError, relay, storageCheck, searchCheck, paymentsCheck] = await Promise.all([
		database(db),
		mail.relayStatus(),
		storage.check(),
		search.check(),
		payments.check()
	]);
	const checks: HealthChecks = {
		database: databaseError ? 'down' : 'ok',
		mail: relay.ok ? 'ok' : 'degraded',
		queue: jobsRunning() ? 'ok' : 'down',
		storage: storageCheck === 'ok' ? 'ok' : 'degraded',
		search: searchCheck === 'ok' ? 'ok' : 'degraded',
		payments: paymentsCheck === 'ok' ? 'ok' : 'degraded'
	};
	const status =
		checks.database === 'down' ? 'down' : Object.values(checks).every((c) => c === 'ok') ? 'ok' : 'degraded';
	if (!withDetails) return { status, checks };
	const details: Record<string, string> = { mailCheckedAt: relay.checkedAt.toISOString() };
	if (databaseError) details.database = databaseError;
	if (relay.error) details.mail = relay.error;
	if (storageCheck !== 'ok') details.storage = storageCheck;
	if (searchCheck !== 'ok') details.search = searchCheck;
	if (paymentsCheck !== 'ok') details.payments = paymentsCheck;
	return { status, checks, details };
}
