/**
 * A property test of the order lifecycle's money (fast-check): random sequences of what the two sides and the
 * clock do to a few orders — pay, post progress, show and approve the fabric, deliver, confirm, cancel, let the
 * release clock run out — each repeated or sent several at once, and sometimes two at once on one order. Whatever
 * the sequence, once the money jobs have settled:
 * - every ledger transaction sums to zero, and no order's escrow is below zero;
 * - for each order, held + advanced + released + refunded + fees = charged, and every processor object is in the
 *   ledger;
 * - the processor's transfers to the tailor never exceed the payout, and no action made two of them;
 * - a release or refund asked for has happened, and the platform's balance at the processor equals escrow plus fees.
 * No request ever answers 5xx.
 */
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { order, progressStep } from '../../src/lib/server/db/schema';
import { unbalancedOrders, unbalancedTransactions } from '../../src/lib/server/payments/escrow';
import { moneyOf } from '../../src/lib/server/payments/ledger';
import { createCommission, createUser, type Person } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { testDb } from './db';
import { callJson, signedIn, type Client } from './http';
import { payableTailor, runJobNow, statusOf, transfersOf, until } from './orders';
import { stripeControl } from './stripe';

// The books' checks import the payments area, whose processor client reads its settings from the environment.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
afterAll(() => pool.end());

type Side = { person: Person; client: Client };
let customer: Side;
let tailor: Side;
let admin: Client;

beforeAll(async () => {
	const person = await createUser(db, { name: 'Lowenna Trevithick' });
	customer = { person, client: await signedIn(person) };
	const payable = await payableTailor(db);
	tailor = { person: payable.person, client: payable.client };
	admin = await signedIn(await createUser(db, { role: 'admin' }));
}, 60_000);

type OrderUnderTest = { id: string; priceMinor: number; payoutMinor: number; feeMinor: number; advanceMinor: number };

/** A fresh order awaiting payment between the two people; `advanceShare` of the most the rules allow (0–1). */
async function newOrder(priceMinor: number, advanceShare: number): Promise<OrderUnderTest> {
	const made = await createCommission(db, { customerId: customer.person.id, status: 'open' });
	const advanceMinor = Math.floor(Math.floor((priceMinor * 3) / 10) * advanceShare);
	const q = await insertQuote(db, {
		commissionId: made.id,
		tailorId: tailor.person.id,
		priceMinor,
		fabricIncluded: true,
		advanceMinor
	});
	const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.person.id });
	const [row] = await db
		.update(order)
		.set({ advanceMinor })
		.where(eq(order.id, orderId))
		.returning({ payout: order.tailorPayoutMinor, fee: order.platformFeeMinor });
	return { id: orderId, priceMinor, payoutMinor: row.payout, feeMinor: row.fee, advanceMinor };
}

type ActionKind =
	'pay' | 'progress' | 'showFabric' | 'approveFabric' | 'deliver' | 'confirm' | 'cancel' | 'autoRelease' | 'next';
type Action = { kind: ActionKind; order: number; times: number; side: 'customer' | 'tailor' | 'both' };

const action = (orders: number) =>
	fc.record({
		kind: fc.oneof(
			{ arbitrary: fc.constant<ActionKind>('next'), weight: 6 },
			{ arbitrary: fc.constant<ActionKind>('pay'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('progress'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('showFabric'), weight: 1 },
			{ arbitrary: fc.constant<ActionKind>('approveFabric'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('deliver'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('confirm'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('cancel'), weight: 2 },
			{ arbitrary: fc.constant<ActionKind>('autoRelease'), weight: 1 }
		),
		order: fc.nat({ max: orders - 1 }),
		// 1 = once; more = the same call sent that many times at once (double clicks, impatient retries).
		times: fc.oneof({ arbitrary: fc.constant(1), weight: 3 }, { arbitrary: fc.integer({ min: 2, max: 6 }), weight: 2 }),
		side: fc.constantFrom<Action['side']>('customer', 'tailor', 'both')
	});

/** One step: one action, or two on (possibly) the same order at the same moment. */
const step = (orders: number) => fc.array(action(orders), { minLength: 1, maxLength: 2 });

const scenario: fc.Arbitrary<Scenario> = fc.record({
	orders: fc.array(
		fc.record({
			priceMinor: fc.integer({ min: 5_000, max: 150_000 }),
			advanceShare: fc.oneof(fc.constant(0), fc.constant(1), fc.double({ min: 0.1, max: 1, noNaN: true }))
		}),
		{ minLength: 2, maxLength: 3 }
	),
	steps: fc.array(step(3), { minLength: 4, maxLength: 12 })
});

const surprises: string[] = [];

/** Any 5xx is a failure of the property; 4xx answers are the system saying no, which is fine. */
async function call(client: Client, method: string, path: string, body?: unknown) {
	const answer = await callJson(client, method, path, body);
	if (answer.status >= 500) surprises.push(`${method} ${path} → ${answer.status} ${JSON.stringify(answer.body)}`);
	return answer;
}

const times = <T>(n: number, make: () => Promise<T>) => Promise.all(Array.from({ length: n }, make));

async function pay(o: OrderUnderTest, n: number) {
	const started = await times(n, () => call(customer.client, 'POST', `/api/v1/orders/${o.id}/checkout`));
	const url = started.find((s) => s.status === 201)?.body.url as string | undefined;
	if (!url) return;
	const paid = await stripeControl().pay(url, TEST_CARDS.success);
	if (paid.status !== 303) return;
	await until(
		() => statusOf(db, o.id),
		(s) => s !== 'awaiting_payment',
		10_000
	);
}

async function showFabric(o: OrderUnderTest) {
	const [row] = await db.select({ status: order.status }).from(order).where(eq(order.id, o.id));
	if (!['funded', 'in_work', 'ready'].includes(row.status)) return;
	// The photo itself goes through the photo pipeline elsewhere; here the step records that one was shown.
	await db.insert(progressStep).values({
		orderId: o.id,
		kind: 'fabric_sourced',
		note: 'The wool-silk, as bought.',
		photoKey: `test/fabric-${o.id}.jpg`,
		photoWidth: 800,
		photoHeight: 600,
		photoAlt: 'Folded grey wool-silk on the cutting table',
		postedById: tailor.person.id
	});
}

async function autoRelease(o: OrderUnderTest, n: number) {
	await db
		.update(order)
		.set({ autoReleaseAt: new Date(Date.now() - 60_000) })
		.where(and(eq(order.id, o.id), eq(order.status, 'delivered'), isNull(order.releaseRequestedAt)));
	await times(n, () => runJobNow(pool, 'order-auto-release'));
}

async function cancel(o: OrderUnderTest, a: Action) {
	const path = `/api/v1/orders/${o.id}/cancel`;
	const sides = a.side === 'both' ? [customer, tailor] : [a.side === 'customer' ? customer : tailor];
	await Promise.all(sides.flatMap((s) => Array.from({ length: a.times }, () => call(s.client, 'POST', path, {}))));
}

/** The step the order would naturally take next, so sequences get as far as release. */
async function next(o: OrderUnderTest, a: Action) {
	const [row] = await db
		.select({ status: order.status, fabricApprovedAt: order.fabricApprovedAt })
		.from(order)
		.where(eq(order.id, o.id));
	if (row.status === 'awaiting_payment') return pay(o, a.times);
	if (row.status === 'funded' && o.advanceMinor > 0 && !row.fabricApprovedAt) {
		await showFabric(o);
		return run({ ...a, kind: 'approveFabric' }, o);
	}
	if (row.status === 'funded') return run({ ...a, kind: 'progress' }, o);
	if (row.status === 'in_work' || row.status === 'ready') return run({ ...a, kind: 'deliver' }, o);
	if (row.status === 'delivered') return run({ ...a, kind: 'confirm' }, o);
}

async function run(a: Action, o: OrderUnderTest): Promise<void> {
	const path = (what: string) => `/api/v1/orders/${o.id}/${what}`;
	switch (a.kind) {
		case 'next':
			return next(o, a);
		case 'pay':
			return pay(o, a.times);
		case 'progress':
			await times(a.times, () =>
				call(tailor.client, 'POST', path('progress'), { step: 'sewing', note: 'Seams pressed.' })
			);
			return;
		case 'showFabric':
			return showFabric(o);
		case 'approveFabric':
			await times(a.times, () => call(customer.client, 'POST', path('fabric-approval'), {}));
			return;
		case 'deliver':
			await times(a.times, () => call(tailor.client, 'POST', path('deliver'), { method: 'pickup' }));
			return;
		case 'confirm':
			await times(a.times, () => call(customer.client, 'POST', path('confirm'), {}));
			return;
		case 'cancel':
			return cancel(o, a);
		case 'autoRelease':
			return autoRelease(o, a.times);
	}
}

const moneyQueues = ['order-release', 'order-refund', 'order-advance'];

/** Waits until no money job is waiting, retrying or running, and every release and refund asked for is done. */
async function settle(orderIds: string[]) {
	return until(
		async () => {
			const jobs = await db.execute<{ n: string }>(sql`
				select count(*) as n from pgboss.job
				where name in (${sql.join(
					moneyQueues.map((q) => sql`${q}`),
					sql`, `
				)}) and state in ('created', 'retry', 'active')`);
			const rows = await db
				.select({
					id: order.id,
					release: order.releaseRequestedAt,
					refund: order.refundRequestedAt,
					status: order.status
				})
				.from(order)
				.where(inArray(order.id, orderIds));
			const undone = rows.filter(
				(r) => (r.release && r.status !== 'released') || (r.refund && !['refunded', 'cancelled'].includes(r.status))
			);
			return { jobs: Number(jobs.rows[0].n), undone };
		},
		(s) => s.jobs === 0 && s.undone.length === 0,
		45_000
	);
}

async function checkInvariants(orders: OrderUnderTest[]) {
	expect(surprises, 'no request answered 5xx').toEqual([]);
	expect(await unbalancedTransactions(db), 'every ledger transaction sums to zero').toEqual([]);
	const books = await unbalancedOrders(db, { orderIds: orders.map((o) => o.id), limit: 100 });
	expect(books.orders, 'each order’s books balance and record every processor object').toEqual([]);
	for (const o of orders) {
		const money = await moneyOf(db, o.id);
		const [row] = await db
			.select({ status: order.status, fabricApprovedAt: order.fabricApprovedAt })
			.from(order)
			.where(eq(order.id, o.id));
		const where = `${o.id} ${row.status} ${JSON.stringify(money)}`;
		expect(money.heldMinor, where).toBeGreaterThanOrEqual(0);
		expect(
			money.heldMinor + money.advancedMinor + money.releasedMinor + money.refundedMinor + money.feeMinor,
			where
		).toBe(money.chargedMinor);
		expect(money.chargedMinor === 0 || money.chargedMinor === o.priceMinor, where).toBe(true);
		expect(money.advancedMinor + money.releasedMinor, where).toBeLessThanOrEqual(o.payoutMinor);
		if (row.status === 'released') reached.released++;
		if (row.status === 'refunded') reached.refunded++;
		if (money.advancedMinor > 0) reached.advancePaid++;
		if (row.status === 'released')
			expect([money.heldMinor, money.advancedMinor + money.releasedMinor, money.feeMinor], where).toEqual([
				0,
				o.payoutMinor,
				o.feeMinor
			]);
		if (row.status === 'refunded')
			expect([money.heldMinor, money.refundedMinor, money.advancedMinor, money.feeMinor], where).toEqual([
				0,
				o.priceMinor,
				0,
				0
			]);

		const transfers = await transfersOf(o.id);
		const net = transfers.reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
		expect(net, `${where}: transfers at the processor`).toBeLessThanOrEqual(o.payoutMinor);
		expect(net, `${where}: transfers match the ledger`).toBe(money.advancedMinor + money.releasedMinor);
		const actions = transfers.map((t) => t.metadata?.action ?? '?');
		expect(new Set(actions).size, `${where}: one transfer per action (${actions.join(', ')})`).toBe(actions.length);
	}
	const escrow = await callJson(admin, 'GET', '/api/v1/admin/escrow');
	expect(escrow.status).toBe(200);
	for (const row of escrow.body.currencies as { currency: string; difference: number }[])
		expect(row.difference, `${row.currency}: the processor holds escrow plus fees`).toBe(0);
}

type Scenario = { orders: { priceMinor: number; advanceShare: number }[]; steps: Action[][] };
const act = (kind: ActionKind, o: number, times = 1, side: Action['side'] = 'customer'): Action[] => [
	{ kind, order: o, times, side }
];

/**
 * Histories every run tries first, so the paths that move money are always among those checked: a release after
 * a paid advance with confirms sent five at once, an automatic release, and cancellations agreed by both sides at
 * the same moment (one after the fabric advance was approved), and work pressed on after an agreed cancellation.
 */
const examples: [Scenario][] = [
	[
		{
			orders: [
				{ priceMinor: 64_250, advanceShare: 1 },
				{ priceMinor: 31_000, advanceShare: 0 }
			],
			steps: [
				act('next', 0),
				act('next', 1),
				act('next', 0, 2),
				[...act('cancel', 1, 2, 'both'), ...act('next', 0)],
				act('next', 0, 3),
				act('confirm', 0, 5)
			]
		}
	],
	[
		{
			orders: [
				{ priceMinor: 48_500, advanceShare: 0.5 },
				{ priceMinor: 22_000, advanceShare: 0 }
			],
			steps: [
				[...act('next', 0), ...act('next', 1)],
				act('next', 0),
				act('cancel', 0, 1, 'both'),
				act('next', 1),
				act('next', 1, 2),
				act('autoRelease', 1, 3)
			]
		}
	],
	[
		// Once both sides agree to cancel, work, delivery and release are refused: only the refund is left.
		{
			orders: [{ priceMinor: 101_221, advanceShare: 0 }],
			steps: [
				act('pay', 0),
				act('cancel', 0, 1, 'both'),
				act('progress', 0, 2, 'both'),
				act('next', 0, 3, 'both'),
				act('deliver', 0, 2, 'both'),
				act('autoRelease', 0)
			]
		}
	]
];

/** What the runs reached, so the test can show the money paths were really taken. */
const reached = { released: 0, refunded: 0, advancePaid: 0 };

describe('the money of random order histories', () => {
	it('keeps every ledger invariant, pays nobody twice and loses no release or refund', async () => {
		await fc.assert(
			fc.asyncProperty(scenario, async ({ orders: specs, steps }) => {
				surprises.length = 0;
				const orders: OrderUnderTest[] = [];
				for (const spec of specs) orders.push(await newOrder(spec.priceMinor, spec.advanceShare));
				for (const group of steps) await Promise.all(group.map((a) => run(a, orders[a.order % orders.length])));
				const settled = await settle(orders.map((o) => o.id));
				expect(settled.jobs, 'the money jobs settle').toBe(0);
				expect(settled.undone, 'every release and refund asked for went through').toEqual([]);
				await checkInvariants(orders);
			}),
			{ numRuns: 15, endOnFailure: true, examples }
		);
		expect(reached.released, 'some runs released an order').toBeGreaterThan(0);
		expect(reached.refunded, 'some runs refunded an order').toBeGreaterThan(0);
		expect(reached.advancePaid, 'some runs paid a fabric advance').toBeGreaterThan(0);
	}, 240_000);
});
