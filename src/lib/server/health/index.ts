import { sql } from 'drizzle-orm';
import { db } from '../db';
import * as mail from '../mail';
import * as storage from '../services/storage';

export type HealthReport = { status: 'ok' | 'degraded'; checks: Record<string, string> };

async function database(): Promise<string> {
	try {
		await db.execute(sql`select 1`);
		return 'ok';
	} catch (error) {
		return error instanceof Error ? error.message : 'unreachable';
	}
}

/** Each hosted service adds its check here. */
export async function report(): Promise<HealthReport> {
	const [databaseCheck, mailCheck, storageCheck] = await Promise.all([database(), mail.check(), storage.check()]);
	const checks = { database: databaseCheck, mail: mailCheck, storage: storageCheck };
	return { status: Object.values(checks).every((c) => c === 'ok') ? 'ok' : 'degraded', checks };
}
