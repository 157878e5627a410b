import { eq, inArray, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import { afterAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/demo/seed-demo';
import { checkMeasurements } from '../../src/lib/drafting';
import {
	commission,
	fitting,
	ledgerEntry,
	measurementProfile,
	notification,
	order,
	payment,
	quote,
	tailorProfile,
	user
} from '../../src/lib/server/db/schema';
import { testDb } from './db';

const { db, pool } = testDb();
afterAll(() => pool.end());

const demoTables = { user, tailorProfile, measurementProfile, commission, quote };

async function demoCounts() {
	const entries = await Promise.all(
		Object.entries(demoTables).map(async ([name, table]) => {
			const [row] = await db
				.select({ n: sql<number>`count(*)::int` })
				.from(table)
				.where(name === 'user' ? sql`${user.email} like '%@tackline.test'` : undefined);
			return [name, row.n] as const;
		})
	);
	return Object.fromEntries(entries);
}

describe('demo seed', () => {
	it('is idempotent, and restores a missing row without touching the rest', async () => {
		const before = await demoCounts();
		expect(before.user).toBeGreaterThanOrEqual(15);
		expect(await seedDemo(db)).toBe('already-seeded');

		await db.delete(user).where(eq(user.email, 'admin@tackline.test'));
		expect(await seedDemo(db)).toBe('seeded');
		expect(await demoCounts()).toEqual(before);
	});

	it('fills the gaps an older seed left in a workroom and keeps what was edited since', async () => {
		const [demoTailor] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'tailor@tackline.test'));
		await db
			.update(tailorProfile)
			.set({ onboardedAt: null, rateCurrency: null, leadTimes: {}, labourHours: {}, hourlyRateMinor: 9900 })
			.where(eq(tailorProfile.userId, demoTailor.id));

		expect(await seedDemo(db)).toBe('already-seeded');

		const [after] = await db.select().from(tailorProfile).where(eq(tailorProfile.userId, demoTailor.id));
		expect(after.onboardedAt).not.toBeNull();
		expect(after.rateCurrency).toMatch(/^[A-Z]{3}$/);
		expect(Object.keys(after.leadTimes).length).toBeGreaterThan(0);
		expect(Object.keys(after.labourHours).length).toBeGreaterThan(0);
		expect(after.hourlyRateMinor).toBe(9900);
	});

	it('gives every demo measurement profile values the measurement checks accept', async () => {
		const profiles = await db
			.select({ label: measurementProfile.label, valuesMm: measurementProfile.valuesMm })
			.from(measurementProfile);
		expect(profiles.length).toBeGreaterThan(0);
		for (const profile of profiles) {
			const result = checkMeasurements(profile.valuesMm, 'cm');
			expect(result.errors, profile.label).toEqual([]);
		}
	});
});

describe('demo orders', () => {
	const customerEmail = 'customer@tackline.test';

	async function demoOrders() {
		return db
			.select({
				id: order.id,
				status: order.status,
				customerId: order.customerId,
				tailorId: order.tailorId,
				priceMinor: order.priceMinor,
				payoutMinor: order.tailorPayoutMinor
			})
			.from(order)
			.innerJoin(user, eq(user.id, order.customerId))
			.where(sql`${user.email} like '%@tackline.test'`);
	}

	it('has the demo customer and tailor’s orders in every stage, and another pair’s', async () => {
		const orders = await demoOrders();
		const [customer] = await db.select({ id: user.id }).from(user).where(eq(user.email, customerEmail));
		const [tailor] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'tailor@tackline.test'));
		const theirs = orders.filter((o) => o.customerId === customer.id && o.tailorId === tailor.id);
		expect(theirs.map((o) => o.status).sort()).toEqual(
			['awaiting_payment', 'delivered', 'in_work', 'ready', 'released'].sort()
		);
		const others = orders.filter((o) => o.customerId !== customer.id);
		expect(others.map((o) => o.status).sort()).toEqual(['funded', 'released']);

		const fittings = await db
			.select({ status: fitting.status })
			.from(fitting)
			.where(
				inArray(
					fitting.orderId,
					theirs.map((o) => o.id)
				)
			);
		expect(fittings.map((f) => f.status).sort()).toEqual(['confirmed', 'proposed', 'proposed', 'proposed']);
		const notices = await db
			.select({ n: sql<number>`count(*)::int` })
			.from(notification)
			.where(eq(notification.userId, customer.id));
		expect(notices[0].n).toBeGreaterThan(0);
	});

	it('made every paid order through the processor: the charge, the ledger and the stand-in agree', async () => {
		const stripe = new Stripe(process.env.STRIPE_SECRET_KEY!, {
			host: process.env.STRIPE_API_HOST,
			port: Number(process.env.STRIPE_API_PORT),
			protocol: 'http',
			maxNetworkRetries: 0
		});
		const paid = (await demoOrders()).filter((o) => o.status !== 'awaiting_payment');
		expect(paid.length).toBeGreaterThanOrEqual(6);
		for (const o of paid) {
			const rows = await db
				.select({ kind: payment.kind, processorId: payment.processorId, amountMinor: payment.amountMinor })
				.from(payment)
				.where(eq(payment.orderId, o.id));
			const charge = rows.find((r) => r.kind === 'charge');
			expect(charge?.amountMinor, o.status).toBe(o.priceMinor);
			const atProcessor = await stripe.charges.retrieve(charge!.processorId);
			expect(atProcessor.amount).toBe(o.priceMinor);
			expect(atProcessor.paid).toBe(true);

			const entries = await db
				.select({ account: ledgerEntry.account, amountMinor: ledgerEntry.amountMinor })
				.from(ledgerEntry)
				.where(eq(ledgerEntry.orderId, o.id));
			expect(entries.reduce((sum, e) => sum + e.amountMinor, 0)).toBe(0);
			const held = entries.filter((e) => e.account === 'escrow').reduce((sum, e) => sum + e.amountMinor, 0);
			const transfers = (await stripe.transfers.list({ transfer_group: o.id, limit: 10 })).data;
			if (o.status === 'released') {
				expect(held).toBe(0);
				expect(transfers.map((t) => t.amount)).toEqual([o.payoutMinor]);
				expect(rows.find((r) => r.kind === 'release_transfer')?.processorId).toBe(transfers[0].id);
			} else {
				expect(held).toBe(o.priceMinor);
				expect(transfers).toEqual([]);
			}
		}
	});
});
