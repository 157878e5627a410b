import { eq } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { awardQuote, createQuote, insertQuote } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { commission, notification, quote } from '../db/schema';
import { queueNames } from '../jobs';
import * as orders from '../orders';
import { anotherQuoteAccepted, reopenAfterCancelledOrder } from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env, ORIGIN: 'http://localhost:5173' } }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
	// As the app's init hook wires it.
	orders.onUnpaidCancelled(reopenAfterCancelledOrder);
});

async function unpaid() {
	const customer = await createUser(db);
	const tailor = await createWorkroom(db);
	const made = await createCommission(db, { customerId: customer.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, priceMinor: 30_000 });
	const rival = await createWorkroom(db);
	const other = await insertQuote(db, { commissionId: made.id, tailorId: rival.id, priceMinor: 28_000 });
	const lapsedRival = await createWorkroom(db);
	const stale = await createQuote(db, {
		commissionId: made.id,
		tailorId: lapsedRival.id,
		status: 'sent',
		priceMinor: 27_000,
		validUntil: new Date(Date.now() + 60_000)
	});
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
	// The stale quote's validity ends while the order waits for payment.
	await db
		.update(quote)
		.set({ validUntil: new Date(Date.now() - 1000) })
		.where(eq(quote.id, stale.id));
	return {
		orderId,
		commissionId: made.id,
		quoteId: q.id,
		otherId: other.id,
		staleId: stale.id,
		customer,
		tailor,
		rival
	};
}

const statusOf = async (id: string) => (await db.select().from(quote).where(eq(quote.id, id)))[0];

describe('cancelling an unpaid order', () => {
	it('opens the commission and the quotes its acceptance declined, while they are valid', async () => {
		const w = await unpaid();
		expect((await statusOf(w.otherId)).declineReason).toBe(anotherQuoteAccepted);
		const done = await orders.cancel(db, {
			orderId: w.orderId,
			actor: { id: w.customer.id, role: 'customer' },
			reason: 'Found one ready-made.'
		});
		expect(done).toMatchObject({
			outcome: 'cancelled',
			order: { status: 'cancelled', cancelReason: 'Found one ready-made.' }
		});
		const [c] = await db.select().from(commission).where(eq(commission.id, w.commissionId));
		expect(c.status).toBe('open');
		expect(c.expiresAt!.getTime()).toBeGreaterThan(Date.now() + 6 * 86_400_000);
		expect(await statusOf(w.otherId)).toMatchObject({ status: 'sent', declineReason: '', decidedAt: null });
		expect((await statusOf(w.staleId)).status).toBe('declined');
		expect(await statusOf(w.quoteId)).toMatchObject({
			status: 'declined',
			declineReason: 'the order was cancelled before payment'
		});
		const told = await db.select().from(notification).where(eq(notification.userId, w.rival.id));
		expect(told.map((n) => n.title)).toEqual(['Your quote is open again']);
		const tailorTold = await db.select().from(notification).where(eq(notification.userId, w.tailor.id));
		expect(tailorTold).toHaveLength(1);
		expect((await orders.cancel(db, { orderId: w.orderId, actor: { id: w.tailor.id, role: 'tailor' } })).outcome).toBe(
			'unchanged'
		);
	});

	it('withdraws the accepted quote when its own tailor cancels', async () => {
		const w = await unpaid();
		await orders.cancel(db, { orderId: w.orderId, actor: { id: w.tailor.id, role: 'tailor' } });
		expect((await statusOf(w.quoteId)).status).toBe('withdrawn');
		expect((await statusOf(w.otherId)).status).toBe('sent');
	});
});
