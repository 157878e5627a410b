import { and, eq } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser } from '../../../../tests/factories';
import { createQuote, createQuotingWorkroom } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { auditEvent, order, quote } from '../db/schema';
import { queueNames } from '../jobs';
import { edit, lapse, QuoteError, send, type Actor } from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env, ORIGIN: 'http://localhost:5173' } }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 6 });
afterAll(() => pool.end());
// No server works the queue here: pg-boss's schema and the mail queue are made as the app's start would.
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

const day = 86_400_000;
const later = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);

function terms(overrides: Partial<Parameters<typeof send>[1]['terms']> = {}) {
	return {
		priceMinor: 16000,
		currency: 'EUR',
		deliveryDate: later(30),
		fittings: 1,
		fabricIncluded: true,
		message: '',
		validUntil: new Date(Date.now() + 7 * day),
		...overrides
	};
}

async function tailorActor(): Promise<Actor> {
	return { id: (await createQuotingWorkroom(db)).id, role: 'tailor' };
}

describe('sending', () => {
	it('lets exactly one of several simultaneous sends by one tailor through', async () => {
		const { id: commissionId } = await createCommission(db, { dateNeeded: later(60) });
		const actor = await tailorActor();
		const results = await Promise.allSettled(
			Array.from({ length: 5 }, () => send(db, { commissionId, actor, terms: terms() }))
		);
		expect(results.filter((r) => r.status === 'fulfilled')).toHaveLength(1);
		for (const r of results.filter((r) => r.status === 'rejected'))
			expect((r.reason as QuoteError).code).toBe('conflict');
		const rows = await db.select().from(quote).where(eq(quote.commissionId, commissionId));
		expect(rows).toHaveLength(1);
	});

	it('warns when accepted orders around the delivery date already fill the workroom', async () => {
		const actor = await tailorActor(); // capacity 2 (see the factory)
		const customer = await createUser(db);
		for (const offset of [25, 40]) {
			const { id } = await createCommission(db, { status: 'awarded', customerId: customer.id });
			const accepted = await createQuote(db, { commissionId: id, tailorId: actor.id, status: 'accepted' });
			await db.insert(order).values({
				commissionId: id,
				quoteId: accepted.id,
				customerId: customer.id,
				tailorId: actor.id,
				priceMinor: 10000,
				platformFeeMinor: 1000,
				tailorPayoutMinor: 9000,
				currency: 'EUR',
				dueDate: later(offset),
				status: offset === 25 ? 'in_work' : 'funded'
			});
		}
		const { id: commissionId } = await createCommission(db, { dateNeeded: later(60) });
		const sent = await send(db, { commissionId, actor, terms: terms({ deliveryDate: later(32) }) });
		expect(sent.warnings.map((w) => w.code)).toEqual(['capacity_full']);
		// Far from both orders, the workroom has room.
		const moved = await edit(db, { id: sent.quote.id, actor, changes: { deliveryDate: later(55) } });
		expect(moved.warnings).toEqual([]);
	});

	it('records no edit when nothing changes', async () => {
		const { id: commissionId } = await createCommission(db, { dateNeeded: later(60) });
		const actor = await tailorActor();
		const sent = await send(db, { commissionId, actor, terms: terms() });
		const same = await edit(db, { id: sent.quote.id, actor, changes: { priceMinor: 16000, fittings: 1 } });
		expect(same.quote.updatedAt).toEqual(sent.quote.updatedAt);
		const events = await db
			.select({ action: auditEvent.action })
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectType, 'quote'), eq(auditEvent.subjectId, sent.quote.id)));
		expect(events.map((e) => e.action)).toEqual(['quote.sent']);
	});
});

describe('lapsing', () => {
	it('lapses a quote once past its date and leaves a still-valid one alone', async () => {
		const { id: commissionId } = await createCommission(db);
		const tailor = await tailorActor();
		const due = await createQuote(db, { commissionId, tailorId: tailor.id, validUntil: new Date(Date.now() - 1000) });
		const other = await tailorActor();
		const valid = await createQuote(db, { commissionId, tailorId: other.id });
		expect(await lapse(db, { id: due.id })).toBe(true);
		expect(await lapse(db, { id: due.id })).toBe(false);
		expect(await lapse(db, { id: valid.id })).toBe(false);
		const rows = await db
			.select({ id: quote.id, status: quote.status })
			.from(quote)
			.where(eq(quote.commissionId, commissionId));
		expect(Object.fromEntries(rows.map((r) => [r.id, r.status]))).toEqual({ [due.id]: 'lapsed', [valid.id]: 'sent' });
	});
});
