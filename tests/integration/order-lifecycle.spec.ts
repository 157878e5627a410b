/**
 * The order lifecycle against the real Stripe stand-in: pay → fabric approved (advance) → progress → deliver →
 * confirm → released, with the ledger and the stand-in's balances checked after every step; twenty confirms at
 * once paying once; cancelling unpaid orders (commission and quotes open again, a late payment refunded);
 * cancelling by agreement (advance reversed, full refund); the automatic release and the paused clock.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { auditEvent, commission, notification, order, progressStep, quote } from '../../src/lib/server/db/schema';
import { TEST_CARDS } from '../../docker/standins/stripe-controller';
import { createQuote } from '../factories/quotes';
import { createWorkroom } from '../factories';
import { testDb } from './db';
import { callJson, signedIn } from './http';
import { waitForMail } from './inbox';
import {
	accountBalance,
	balancedLedger,
	deliver,
	moneyAddsUp,
	paidOrder,
	paymentsOf,
	platformBalance,
	runJobNow,
	sdk,
	statusOf,
	transfersOf,
	unpaidOrder,
	until,
	view,
	viewUntil
} from './orders';
import { stripeControl } from './stripe';

const { db, pool } = testDb();
afterAll(() => pool.end());

const post = (client: Parameters<typeof callJson>[0], orderId: string, action: string, body?: unknown) =>
	callJson(client, 'POST', `/api/v1/orders/${orderId}/${action}`, body);

/** Shows the fabric: the tailor posts `fabric_sourced` and its photo is attached (as the order page's upload does). */
async function showFabric(o: Awaited<ReturnType<typeof paidOrder>>) {
	const posted = await post(o.tailorClient, o.orderId, 'progress', {
		step: 'fabric_sourced',
		note: 'Irish linen, 240 g/m², oatmeal.'
	});
	expect(posted.status, JSON.stringify(posted.body)).toBe(201);
	await db
		.update(progressStep)
		.set({ photoKey: `orders/${o.orderId}/fabric.jpg`, photoWidth: 1200, photoHeight: 900, photoAlt: 'Oatmeal linen' })
		.where(eq(progressStep.id, posted.body.id as string));
}

describe('from payment to release', () => {
	it('moves the money right at every step, with the advance deducted from the release', async () => {
		const platformBefore = await platformBalance();
		const o = await paidOrder(db, { priceMinor: 52_000, advanceMinor: 12_000 });
		// 10 % fee on €520.00 is €52.00; the tailor's share €468.00, of which €120.00 comes early.
		expect(o.feeMinor).toBe(5_200);
		expect(o.payoutMinor).toBe(46_800);

		let v = await view(o.customerClient, o.orderId);
		expect(v).toMatchObject({ status: 'funded', advanceMinor: 12_000, releaseRequestedAt: null });
		expect(v.money).toEqual({
			chargedMinor: 52_000,
			heldMinor: 52_000,
			advancedMinor: 0,
			releasedMinor: 0,
			refundedMinor: 0,
			feeMinor: 0
		});
		expect(await platformBalance()).toBe(platformBefore + 52_000);
		expect(await accountBalance(o.accountId)).toBe(0);

		// Approving before the fabric is shown is refused; the tailor shows it and the work has not started.
		const early = await post(o.customerClient, o.orderId, 'fabric-approval');
		expect(early.status).toBe(409);
		await showFabric(o);
		expect(await statusOf(db, o.orderId)).toBe('funded');
		const approved = await post(o.customerClient, o.orderId, 'fabric-approval');
		expect([200, 202]).toContain(approved.status);
		v = await viewUntil(o.customerClient, o.orderId, (x) => x.money.advancedMinor > 0);
		expect(v.money).toMatchObject({ heldMinor: 40_000, advancedMinor: 12_000, releasedMinor: 0 });
		expect(v.fabricApprovedAt).not.toBeNull();
		expect(await accountBalance(o.accountId)).toBe(12_000);
		expect(await platformBalance()).toBe(platformBefore + 40_000);
		expect(await paymentsOf(db, o.orderId, 'advance_transfer')).toEqual([
			expect.objectContaining({ amountMinor: 12_000, key: `advance:${o.orderId}` })
		]);
		expect((await post(o.customerClient, o.orderId, 'fabric-approval')).status).toBe(200);

		// Progress starts the work.
		const cut = await post(o.tailorClient, o.orderId, 'progress', { step: 'cutting', note: 'Cut today.' });
		expect(cut.status).toBe(201);
		expect(cut.body).toMatchObject({ step: 'cutting', note: 'Cut today.' });
		v = await view(o.tailorClient, o.orderId);
		expect(v.status).toBe('in_work');
		expect(v.workStartedAt).not.toBeNull();
		expect(v.progress.map((p: { step: string }) => p.step)).toEqual(['fabric_sourced', 'cutting']);
		expect(v.progress[0].photo).toEqual({ width: 1200, height: 900, alt: 'Oatmeal linen' });
		expect((await waitForMail(o.customer.email, { subject: 'News on “Linen summer suit”: cut' })).text).toContain(
			`/orders/${o.orderId}`
		);

		// Confirming before delivery is a conflict; a courier needs its tracking reference.
		const tooSoon = await post(o.customerClient, o.orderId, 'confirm');
		expect(tooSoon.status).toBe(409);
		expect(tooSoon.body.error.message).toMatch(/in work/);
		const untracked = await post(o.tailorClient, o.orderId, 'deliver', { method: 'courier' });
		expect(untracked.status).toBe(400);
		expect(untracked.body.error.issues).toEqual([expect.objectContaining({ path: 'trackingReference' })]);
		const delivered = await post(o.tailorClient, o.orderId, 'deliver', {
			method: 'courier',
			trackingReference: 'MG-4471-2209',
			note: 'Sent tracked, signature on delivery.'
		});
		expect(delivered.status).toBe(200);
		expect(delivered.body).toMatchObject({
			status: 'delivered',
			delivery: { method: 'courier', trackingReference: 'MG-4471-2209' }
		});
		const clock = new Date(delivered.body.autoReleaseAt as string).getTime() - Date.now();
		expect(clock).toBeGreaterThan(6.9 * 86_400_000);
		expect(clock).toBeLessThan(7.1 * 86_400_000);
		expect(delivered.body.money).toMatchObject({ heldMinor: 40_000, releasedMinor: 0 });

		// Only the customer confirms; then the release goes through once.
		expect((await post(o.tailorClient, o.orderId, 'confirm')).status).toBe(403);
		const confirmed = await post(o.customerClient, o.orderId, 'confirm');
		expect([200, 202]).toContain(confirmed.status);
		expect(confirmed.body.releaseRequestedAt).not.toBeNull();
		v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'released');
		expect(v.status).toBe('released');
		expect(v.money).toEqual({
			chargedMinor: 52_000,
			heldMinor: 0,
			advancedMinor: 12_000,
			releasedMinor: 34_800,
			refundedMinor: 0,
			feeMinor: 5_200
		});
		moneyAddsUp(v.money);
		expect(await accountBalance(o.accountId)).toBe(46_800);
		expect(await platformBalance()).toBe(platformBefore + 5_200);
		const transfers = await transfersOf(o.orderId);
		expect(transfers.map((t) => t.amount).sort((a, b) => a - b)).toEqual([12_000, 34_800]);
		expect(transfers.every((t) => t.destination === o.accountId)).toBe(true);
		expect(await paymentsOf(db, o.orderId, 'release_transfer')).toEqual([
			expect.objectContaining({ amountMinor: 34_800, key: `release:${o.orderId}` })
		]);
		await balancedLedger(db, o.orderId);
		expect((await post(o.customerClient, o.orderId, 'confirm')).status).toBe(200);
		await waitForMail(o.tailor.email, { subject: 'Payout sent for “Linen summer suit”' });
		const released = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, o.orderId), eq(auditEvent.action, 'order.released')));
		expect(released).toHaveLength(1);
	}, 90_000);

	it('pays once for a double click and for twenty confirms at once', async () => {
		const o = await paidOrder(db, { priceMinor: 30_000 });
		await deliver(o);
		const [first, second] = [
			await post(o.customerClient, o.orderId, 'confirm'),
			await post(o.customerClient, o.orderId, 'confirm')
		];
		expect([200, 202]).toContain(first.status);
		expect([200, 202]).toContain(second.status);
		const crowd = await Promise.all(Array.from({ length: 20 }, () => post(o.customerClient, o.orderId, 'confirm')));
		for (const answer of crowd) expect([200, 202]).toContain(answer.status);
		const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'released');
		expect(v.money).toMatchObject({ heldMinor: 0, releasedMinor: 27_000, feeMinor: 3_000 });
		expect(await transfersOf(o.orderId)).toHaveLength(1);
		expect(await paymentsOf(db, o.orderId, 'release_transfer')).toHaveLength(1);
		expect(await accountBalance(o.accountId)).toBe(27_000);
		const asked = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, o.orderId), eq(auditEvent.action, 'order.delivery_confirmed')));
		expect(asked).toHaveLength(1);
	}, 60_000);
});

describe('cancelling before payment', () => {
	it('cancels at once, opens the commission and the declined quotes again, and closes the payment page', async () => {
		const o = await unpaidOrder(db, { priceMinor: 41_000 });
		// Another tailor's quote that the acceptance declined, and one that has expired meanwhile.
		const rival = await createWorkroom(db);
		const late = await createWorkroom(db);
		const declined = await createQuote(db, {
			commissionId: o.commissionId,
			tailorId: rival.id,
			status: 'declined',
			declineReason: 'another quote was accepted'
		});
		const expired = await createQuote(db, {
			commissionId: o.commissionId,
			tailorId: late.id,
			status: 'declined',
			declineReason: 'another quote was accepted',
			validUntil: new Date(Date.now() - 86_400_000)
		});
		const checkout = await post(o.customerClient, o.orderId, 'checkout');
		expect(checkout.status).toBe(201);
		const sessionId = (checkout.body.url as string).split('/').pop()!;

		const cancelled = await post(o.tailorClient, o.orderId, 'cancel', { reason: 'I cannot source the linen in time.' });
		expect(cancelled.status, JSON.stringify(cancelled.body)).toBe(200);
		expect(cancelled.body).toMatchObject({
			status: 'cancelled',
			cancellation: { reason: 'I cannot source the linen in time.' }
		});
		const [c] = await db
			.select({ status: commission.status })
			.from(commission)
			.where(eq(commission.id, o.commissionId));
		expect(c.status).toBe('open');
		const quotes = await db
			.select({ id: quote.id, status: quote.status })
			.from(quote)
			.where(eq(quote.commissionId, o.commissionId));
		const statusOfQuote = (id: string) => quotes.find((q) => q.id === id)?.status;
		expect(statusOfQuote(declined.id)).toBe('sent');
		expect(statusOfQuote(expired.id)).toBe('declined');
		expect(statusOfQuote(o.quoteId)).toBe('withdrawn');
		const told = await db
			.select({ title: notification.title })
			.from(notification)
			.where(eq(notification.userId, rival.id));
		expect(told.map((n) => n.title)).toContain('Your quote is open again');
		await waitForMail(o.customer.email, { subject: 'Order cancelled: “Linen summer suit”' });
		expect(
			(
				await until(
					() => sdk().checkout.sessions.retrieve(sessionId),
					(s) => s.status === 'expired'
				)
			).status
		).toBe('expired');

		// Cancelling again changes nothing; paying is refused.
		expect((await post(o.customerClient, o.orderId, 'cancel')).status).toBe(200);
		expect((await post(o.customerClient, o.orderId, 'checkout')).status).toBe(409);
	}, 60_000);

	it('refunds a payment that arrives after the order was cancelled', async () => {
		const o = await unpaidOrder(db, { priceMinor: 27_500 });
		const platformBefore = await platformBalance();
		const checkout = await post(o.customerClient, o.orderId, 'checkout');
		// The customer was on the payment page when the order was cancelled (and the page could not be closed).
		await db.update(order).set({ status: 'cancelled', cancelledAt: new Date() }).where(eq(order.id, o.orderId));
		const paid = await stripeControl().pay(checkout.body.url as string, TEST_CARDS.success);
		expect(paid.status).toBe(303);
		const v = await viewUntil(o.customerClient, o.orderId, (x) => x.money.refundedMinor > 0);
		expect(v.status).toBe('cancelled');
		expect(v.money).toMatchObject({ chargedMinor: 27_500, heldMinor: 0, refundedMinor: 27_500 });
		moneyAddsUp(v.money);
		expect(await paymentsOf(db, o.orderId, 'refund')).toEqual([
			expect.objectContaining({ amountMinor: 27_500, key: `refund:${o.orderId}` })
		]);
		expect(await platformBalance()).toBe(platformBefore);
		await waitForMail(o.customer.email, { subject: 'Refund on its way for “Linen summer suit”' });
	}, 60_000);
});

describe('cancelling a paid order by agreement', () => {
	it('asks, agrees, reverses the advance and refunds the whole payment', async () => {
		const platformBefore = await platformBalance();
		const o = await paidOrder(db, { priceMinor: 40_000, advanceMinor: 9_000 });
		await showFabric(o);
		await post(o.customerClient, o.orderId, 'fabric-approval');
		await viewUntil(o.customerClient, o.orderId, (x) => x.money.advancedMinor === 9_000);
		expect(await accountBalance(o.accountId)).toBe(9_000);

		// An admin cannot cancel a paid order; the tailor asks, declines are possible, the customer agrees.
		const asked = await post(o.tailorClient, o.orderId, 'cancel', { reason: 'Bereavement in the family.' });
		expect(asked.status).toBe(200);
		expect(asked.body.cancellation.request).toMatchObject({ by: 'tailor', reason: 'Bereavement in the family.' });
		expect((await post(o.tailorClient, o.orderId, 'cancel')).body.status).toBe('funded');
		const agreed = await post(o.customerClient, o.orderId, 'cancel');
		expect(agreed.status).toBe(202);
		const v = await viewUntil(o.customerClient, o.orderId, (x) => x.status === 'refunded');
		expect(v.money).toEqual({
			chargedMinor: 40_000,
			heldMinor: 0,
			advancedMinor: 0,
			releasedMinor: 0,
			refundedMinor: 40_000,
			feeMinor: 0
		});
		expect(await accountBalance(o.accountId)).toBe(0);
		expect(await platformBalance()).toBe(platformBefore);
		expect(await paymentsOf(db, o.orderId, 'reversal')).toEqual([
			expect.objectContaining({ amountMinor: 9_000, key: `reversal:advance:${o.orderId}` })
		]);
		expect(await paymentsOf(db, o.orderId, 'refund')).toHaveLength(1);
		await balancedLedger(db, o.orderId);
	}, 90_000);

	it('refuses to cancel once work has started, and a decline keeps the order going', async () => {
		const o = await paidOrder(db, { priceMinor: 20_000 });
		const asked = await post(o.customerClient, o.orderId, 'cancel', { reason: 'Changed my mind.' });
		expect(asked.body.cancellation.request).toMatchObject({ by: 'customer' });
		const declined = await post(o.tailorClient, o.orderId, 'cancel', { decline: true });
		expect(declined.status).toBe(200);
		expect(declined.body.cancellation.request).toBeNull();
		expect((await post(o.tailorClient, o.orderId, 'progress', { step: 'pattern_drafted' })).status).toBe(201);
		const refused = await post(o.customerClient, o.orderId, 'cancel');
		expect(refused.status).toBe(409);
		expect(refused.body.error.message).toMatch(/dispute/);
		expect(await statusOf(db, o.orderId)).toBe('in_work');
	}, 60_000);
});

describe('the release clock', () => {
	it('pauses for an alteration and releases on its own once it runs out', async () => {
		const o = await paidOrder(db, { priceMinor: 36_000 });
		await deliver(o);
		const altered = await post(o.customerClient, o.orderId, 'alteration', { note: 'Take the waist in by 1 cm.' });
		expect(altered.status).toBe(200);
		expect(altered.body).toMatchObject({ status: 'delivered', autoReleaseAt: null });
		expect(altered.body.alteration).toMatchObject({ note: 'Take the waist in by 1 cm.' });
		expect((await post(o.customerClient, o.orderId, 'alteration', { note: '' })).status).toBe(400);

		// While the alteration is open, nothing is released, whatever the clock said.
		await db
			.update(order)
			.set({ autoReleaseAt: new Date(Date.now() - 60_000) })
			.where(eq(order.id, o.orderId));
		await runJobNow(pool, 'order-auto-release');
		await new Promise((resolve) => setTimeout(resolve, 3000));
		expect(await statusOf(db, o.orderId)).toBe('delivered');
		expect(await transfersOf(o.orderId)).toHaveLength(0);

		const again = await post(o.tailorClient, o.orderId, 'deliver', { method: 'pickup', note: 'Waist taken in.' });
		expect(again.status).toBe(200);
		expect(again.body.alteration).toBeNull();
		expect(again.body.autoReleaseAt).not.toBeNull();

		await db
			.update(order)
			.set({ autoReleaseAt: new Date(Date.now() - 60_000) })
			.where(eq(order.id, o.orderId));
		await runJobNow(pool, 'order-auto-release');
		const v = await viewUntil(o.tailorClient, o.orderId, (x) => x.status === 'released', 30_000);
		expect(v.money).toMatchObject({ heldMinor: 0, releasedMinor: 32_400, feeMinor: 3_600 });
		expect(await transfersOf(o.orderId)).toHaveLength(1);
		const auto = await db
			.select()
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectId, o.orderId), eq(auditEvent.action, 'order.auto_release')));
		expect(auto).toHaveLength(1);
	}, 90_000);
});

describe('answers for the wrong person or state', () => {
	it('hides the order from strangers and names the state in conflicts', async () => {
		const o = await unpaidOrder(db, { priceMinor: 15_000 });
		const stranger = await signedIn(await createWorkroom(db));
		const missing = await post(stranger, '00000000-0000-4000-8000-000000000000', 'deliver', { method: 'pickup' });
		const hidden = await post(stranger, o.orderId, 'deliver', { method: 'pickup' });
		expect(missing.status).toBe(404);
		expect(hidden.status).toBe(404);
		expect(hidden.body).toEqual(missing.body);
		expect((await post(o.customerClient, o.orderId, 'progress', { step: 'cutting' })).status).toBe(403);
		const unpaid = await post(o.tailorClient, o.orderId, 'progress', { step: 'cutting' });
		expect(unpaid.status).toBe(409);
		expect(unpaid.body.error.message).toMatch(/awaiting payment/);
		const bad = await post(o.tailorClient, o.orderId, 'progress', { step: 'dancing', extra: 1 });
		expect(bad.status).toBe(400);
		expect(bad.body.error.code).toBe('invalid_input');
	});
});
