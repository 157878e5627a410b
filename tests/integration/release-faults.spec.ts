/**
 * Money under faults: with the Stripe stand-in failing 30 % of transfer and refund calls outright and timing out
 * on another 30 % (the call carried out, its answer lost), every release and refund still completes through the
 * jobs' retries — and each order gets exactly one transfer or refund, the ledger matching the stand-in. A call
 * that keeps failing alerts every admin once, and completes when the processor is back.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { auditEvent, notification } from '../../src/lib/server/db/schema';
import { createUser } from '../factories';
import { testDb } from './db';
import { callJson } from './http';
import {
	accountBalance,
	balancedLedger,
	sdk,
	deliver,
	moneyAddsUp,
	paidOrder,
	paymentsOf,
	platformBalance,
	transfersOf,
	viewUntil,
	type PaidOrder
} from './orders';
import { stripeControl } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());
const control = stripeControl();
afterEach(() => control.clearFaults());

const post = (client: PaidOrder['customerClient'], orderId: string, action: string, body?: unknown) =>
	callJson(client, 'POST', `/api/v1/orders/${orderId}/${action}`, body);

const moneyPaths = ['POST /v1/transfers', 'POST /v1/refunds'];

describe('releases and refunds while the processor misbehaves', () => {
	it('completes every one through retries and pays nobody twice', async () => {
		const platformBefore = await platformBalance();
		const releases = await Promise.all([
			paidOrder(db, { priceMinor: 21_000 }),
			paidOrder(db, { priceMinor: 33_300 }),
			paidOrder(db, { priceMinor: 48_000 })
		]);
		const refunds = await Promise.all([paidOrder(db, { priceMinor: 19_900 }), paidOrder(db, { priceMinor: 25_000 })]);
		for (const o of releases) await deliver(o);

		await control.setFaults({ errorRate: 0.3, timeoutRate: 0.3, hangMs: 300, paths: moneyPaths });
		for (const o of releases) {
			const confirmed = await post(o.customerClient, o.orderId, 'confirm');
			expect([200, 202]).toContain(confirmed.status);
		}
		for (const o of refunds) {
			expect((await post(o.customerClient, o.orderId, 'cancel', { reason: 'Moving abroad.' })).status).toBe(200);
			expect((await post(o.tailorClient, o.orderId, 'cancel')).status).toBe(202);
		}

		for (const o of releases) {
			const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'released', 120_000);
			expect(v.status).toBe('released');
			expect(v.money).toMatchObject({ heldMinor: 0, releasedMinor: o.payoutMinor, feeMinor: o.feeMinor });
			moneyAddsUp(v.money);
			expect(await transfersOf(o.orderId)).toHaveLength(1);
			expect(await paymentsOf(db, o.orderId, 'release_transfer')).toHaveLength(1);
			expect(await accountBalance(o.accountId)).toBe(o.payoutMinor);
			await balancedLedger(db, o.orderId);
		}
		for (const o of refunds) {
			const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'refunded', 120_000);
			expect(v.status).toBe('refunded');
			expect(v.money).toMatchObject({ heldMinor: 0, refundedMinor: o.priceMinor });
			expect(await paymentsOf(db, o.orderId, 'refund')).toHaveLength(1);
		}
		// Each refund order gave back exactly what it took, each release left exactly its fee: nothing twice.
		const fees = releases.reduce((sum, o) => sum + o.feeMinor, 0);
		expect(await platformBalance()).toBe(platformBefore + fees);
	}, 240_000);

	it('alerts every admin once when a release keeps failing, and finishes when the processor is back', async () => {
		const admin = await createUser(db, { role: 'admin' });
		const o = await paidOrder(db, { priceMinor: 17_000 });
		await deliver(o);
		await control.setFaults({ errorRate: 1, paths: ['POST /v1/transfers'] });
		expect((await post(o.customerClient, o.orderId, 'confirm')).status).toBe(202);
		const deadline = Date.now() + 120_000;
		let alerts: { title: string }[] = [];
		while (Date.now() < deadline) {
			alerts = await db
				.select({ title: notification.title })
				.from(notification)
				.where(and(eq(notification.userId, admin.id), eq(notification.event, 'money_stuck')));
			if (alerts.length) break;
			await new Promise((resolve) => setTimeout(resolve, 500));
		}
		expect(alerts).toHaveLength(1);
		expect(alerts[0].title).toMatch(/release is stuck/);
		expect(await transfersOf(o.orderId)).toHaveLength(0);
		const failures = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, o.orderId), eq(auditEvent.action, 'order.money_call_failed')));
		expect(failures.length).toBeGreaterThanOrEqual(5);

		await control.clearFaults();
		const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'released', 120_000);
		expect(v.money).toMatchObject({ heldMinor: 0, releasedMinor: o.payoutMinor });
		expect(await transfersOf(o.orderId)).toHaveLength(1);
		const stuck = await db
			.select()
			.from(notification)
			.where(and(eq(notification.userId, admin.id), eq(notification.event, 'money_stuck')));
		expect(stuck).toHaveLength(1);
	}, 300_000);

	it('finds a transfer the processor already made once its idempotency key is forgotten, and makes no second one', async () => {
		const o = await paidOrder(db, { priceMinor: 27_500 });
		await deliver(o);
		const [charge] = await paymentsOf(db, o.orderId, 'charge');
		// As if an earlier attempt went through more than a day ago: the processor no longer knows its key.
		const earlier = await sdk().transfers.create(
			{
				amount: o.payoutMinor,
				currency: 'eur',
				destination: o.accountId,
				source_transaction: charge.processorId,
				transfer_group: o.orderId,
				metadata: { order_id: o.orderId, action: 'release' }
			},
			{ idempotencyKey: `forgotten:${o.orderId}` }
		);

		expect([200, 202]).toContain((await post(o.customerClient, o.orderId, 'confirm')).status);
		const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'released', 60_000);
		expect(v.money).toMatchObject({ heldMinor: 0, releasedMinor: o.payoutMinor });
		expect((await transfersOf(o.orderId)).map((t) => t.id)).toEqual([earlier.id]);
		const [release] = await paymentsOf(db, o.orderId, 'release_transfer');
		expect(release.processorId).toBe(earlier.id);
		expect(await accountBalance(o.accountId)).toBe(o.payoutMinor);
	}, 120_000);
});
