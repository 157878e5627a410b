import { and, eq, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { awardQuote, insertQuote } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { auditEvent, notification, order, type OrderStatus } from '../db/schema';
import { queueNames } from '../jobs';
import {
	approveFabric,
	cancel,
	confirmDelivery,
	declineCancellation,
	markDelivered,
	markReady,
	OrderError,
	postProgress,
	releaseDue,
	requestAlteration,
	type OrderActor
} from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env, ORIGIN: 'http://localhost:5173' } }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());
// No server works the queues here: pg-boss's schema and the queues are made as the app's start would.
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	for (const name of [queueNames.mail, queueNames.orderRelease, queueNames.orderRefund, queueNames.orderAdvance])
		await boss.createQueue(name, { name, policy: name === queueNames.mail ? 'standard' : 'stately' });
	await boss.stop({ graceful: false, wait: true });
});

type World = { orderId: string; commissionId: string; quoteId: string; customer: OrderActor; tailor: OrderActor };

async function orderIn(status: OrderStatus, extra: Partial<typeof order.$inferInsert> = {}): Promise<World> {
	const person = await createUser(db);
	const workroom = await createWorkroom(db);
	const made = await createCommission(db, { customerId: person.id, status: 'open' });
	const q = await insertQuote(db, { commissionId: made.id, tailorId: workroom.id, priceMinor: 30_000 });
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: person.id });
	await db
		.update(order)
		.set({ status, ...(status === 'awaiting_payment' ? {} : { fundedAt: new Date() }), ...extra })
		.where(eq(order.id, orderId));
	return {
		orderId,
		commissionId: made.id,
		quoteId: q.id,
		customer: { id: person.id, role: 'customer' },
		tailor: { id: workroom.id, role: 'tailor' }
	};
}

const rowOf = async (orderId: string) => (await db.select().from(order).where(eq(order.id, orderId)))[0];

async function jobsFor(name: string, orderId: string) {
	const result = await db.execute(
		sql`select count(*)::int as n from pgboss.job where name = ${name} and data ->> 'orderId' = ${orderId}`
	);
	return (result.rows[0] as { n: number }).n;
}

async function refusal(promise: Promise<unknown>): Promise<OrderError> {
	const error = await promise.then(
		() => null,
		(e: unknown) => e
	);
	expect(error).toBeInstanceOf(OrderError);
	return error as OrderError;
}

describe('progress', () => {
	it('starts the work with the first step other than fabric, and a repeat posts nothing new', async () => {
		const w = await orderIn('funded');
		const fabric = await postProgress(db, { orderId: w.orderId, actor: w.tailor, input: { step: 'fabric_sourced' } });
		expect(fabric.order.status).toBe('funded');
		const cut = await postProgress(db, {
			orderId: w.orderId,
			actor: w.tailor,
			input: { step: 'cutting', note: ' Cut. ' }
		});
		expect(cut).toMatchObject({ created: true, order: { status: 'in_work' }, step: { note: 'Cut.' } });
		expect(cut.order.workStartedAt).not.toBeNull();
		const again = await postProgress(db, {
			orderId: w.orderId,
			actor: w.tailor,
			input: { step: 'cutting', note: 'Cut.' }
		});
		expect(again).toMatchObject({ created: false, step: { id: cut.step.id } });
		const told = await db.select().from(notification).where(eq(notification.userId, w.customer.id));
		expect(told).toHaveLength(2);
	});

	it('is the tailor’s alone, and only while the work can go on', async () => {
		const w = await orderIn('awaiting_payment');
		expect(
			(await refusal(postProgress(db, { orderId: w.orderId, actor: w.customer, input: { step: 'cutting' } }))).code
		).toBe('forbidden');
		const stranger: OrderActor = { id: (await createWorkroom(db)).id, role: 'tailor' };
		expect(
			(await refusal(postProgress(db, { orderId: w.orderId, actor: stranger, input: { step: 'cutting' } }))).code
		).toBe('not_found');
		const early = await refusal(postProgress(db, { orderId: w.orderId, actor: w.tailor, input: { step: 'cutting' } }));
		expect(early.code).toBe('conflict');
		expect(early.message).toMatch(/awaiting payment/);
	});
});

describe('delivery and the release clock', () => {
	it('delivers once, pauses for an alteration and starts a fresh clock on redelivery', async () => {
		const w = await orderIn('in_work');
		expect((await markReady(db, { orderId: w.orderId, actor: w.tailor })).status).toBe('ready');
		expect((await markReady(db, { orderId: w.orderId, actor: w.tailor })).status).toBe('ready');
		const courier = await refusal(
			markDelivered(db, { orderId: w.orderId, actor: w.tailor, input: { method: 'courier', trackingReference: ' ' } })
		);
		expect(courier).toMatchObject({ code: 'invalid', issues: [{ path: 'trackingReference' }] });
		const at = new Date('2026-12-01T10:00:00Z');
		const delivered = await markDelivered(db, {
			orderId: w.orderId,
			actor: w.tailor,
			input: { method: 'pickup' },
			now: at
		});
		// Seven days by default (AUTO_RELEASE_DAYS unset).
		expect(delivered.autoReleaseAt).toEqual(new Date('2026-12-08T10:00:00Z'));
		const same = await markDelivered(db, { orderId: w.orderId, actor: w.tailor, input: { method: 'pickup' } });
		expect(same.deliveredAt).toEqual(at);

		const altered = await requestAlteration(db, {
			orderId: w.orderId,
			actor: w.customer,
			note: 'Shorten the sleeves.'
		});
		expect(altered).toMatchObject({ status: 'delivered', autoReleaseAt: null, alterationNote: 'Shorten the sleeves.' });
		// Other delivered orders in the seeded data may fall due; this one, paused, must not.
		await releaseDue(db, { now: new Date(Date.now() + 30 * 86_400_000) });
		expect(await jobsFor(queueNames.orderRelease, w.orderId)).toBe(0);

		const back = await markDelivered(db, { orderId: w.orderId, actor: w.tailor, input: { method: 'pickup' } });
		expect(back.alterationRequestedAt).toBeNull();
		expect(back.autoReleaseAt!.getTime()).toBeGreaterThan(Date.now());
		expect(await releaseDue(db, { now: new Date(back.autoReleaseAt!.getTime() + 1000) })).toBe(1);
		expect(await jobsFor(queueNames.orderRelease, w.orderId)).toBe(1);
		expect((await rowOf(w.orderId)).releaseRequestedAt).not.toBeNull();
		expect(await releaseDue(db, { now: new Date(back.autoReleaseAt!.getTime() + 1000) })).toBe(0);
	});

	it('asks for release once however often the customer confirms', async () => {
		const w = await orderIn('delivered', { deliveredAt: new Date(), deliveryMethod: 'pickup' });
		expect((await refusal(confirmDelivery(db, { orderId: w.orderId, actor: w.tailor }))).code).toBe('forbidden');
		const answers = await Promise.all(
			Array.from({ length: 10 }, () => confirmDelivery(db, { orderId: w.orderId, actor: w.customer }))
		);
		expect(new Set(answers.map((a) => a.releaseRequestedAt?.getTime())).size).toBe(1);
		expect(await jobsFor(queueNames.orderRelease, w.orderId)).toBe(1);
		const confirmed = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, w.orderId), eq(auditEvent.action, 'order.delivery_confirmed')));
		expect(confirmed).toHaveLength(1);
		const late = await refusal(requestAlteration(db, { orderId: w.orderId, actor: w.customer, note: 'Hem' }));
		expect(late.code).toBe('conflict');
	});
});

describe('the fabric advance', () => {
	it('needs an advance and a photo of the fabric, then asks for the transfer once', async () => {
		const none = await orderIn('funded');
		expect((await refusal(approveFabric(db, { orderId: none.orderId, actor: none.customer }))).message).toMatch(
			/no materials advance/
		);
		const w = await orderIn('funded', { advanceMinor: 9_000 });
		expect((await refusal(approveFabric(db, { orderId: w.orderId, actor: w.customer }))).message).toMatch(/not shown/);
		await postProgress(db, {
			orderId: w.orderId,
			actor: w.tailor,
			input: { step: 'fabric_sourced', photo: { key: 'orders/x/fabric.jpg', width: 800, height: 600, alt: 'Tweed' } }
		});
		const approved = await approveFabric(db, { orderId: w.orderId, actor: w.customer });
		expect(approved.fabricApprovedAt).not.toBeNull();
		await approveFabric(db, { orderId: w.orderId, actor: w.customer });
		expect(await jobsFor(queueNames.orderAdvance, w.orderId)).toBe(1);
	});
});

describe('cancelling', () => {
	it('needs both sides for a paid order, and refuses once work has started', async () => {
		const w = await orderIn('funded');
		expect((await cancel(db, { orderId: w.orderId, actor: w.customer })).outcome).toBe('requested');
		expect((await cancel(db, { orderId: w.orderId, actor: w.customer })).outcome).toBe('unchanged');
		await declineCancellation(db, { orderId: w.orderId, actor: w.tailor });
		expect((await cancel(db, { orderId: w.orderId, actor: w.tailor })).outcome).toBe('requested');
		const agreed = await cancel(db, { orderId: w.orderId, actor: w.customer });
		expect(agreed.outcome).toBe('agreed');
		expect(agreed.order.refundRequestedAt).not.toBeNull();
		expect(await jobsFor(queueNames.orderRefund, w.orderId)).toBe(1);

		const started = await orderIn('in_work', { workStartedAt: new Date() });
		const refused = await refusal(cancel(db, { orderId: started.orderId, actor: started.customer }));
		expect(refused.code).toBe('conflict');
		expect(refused.message).toMatch(/dispute/);
		const admin: OrderActor = { id: (await createUser(db, { role: 'admin' })).id, role: 'admin' };
		expect((await refusal(cancel(db, { orderId: started.orderId, actor: admin }))).code).toBe('forbidden');
	});
});
