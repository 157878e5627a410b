/**
 * Moving an order along: only the order's tailor posts progress and delivers; only its customer confirms,
 * asks for an alteration and approves the fabric; either party (and an admin, for an unpaid order) cancels.
 * Everyone else — another customer, a tailor with no part in it — finds no such order; the wrong party gets
 * 403 and the order is left as it was. In these rows `owner` is the order's customer and `tailor` its tailor.
 */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { order, progressStep, type OrderStatus } from '../../../src/lib/server/db/schema';
import { createCommission } from '../../factories';
import { awardQuote, insertQuote } from '../../factories/quotes';
import type { Expectations, Row, World } from './matrix';

type Arranged = { orderId: string; status: OrderStatus; secrets: string[] };

/** An order of the owner's with `cast.tailor`, put straight into `status` (no money moves in these rows). */
function orderIn(status: OrderStatus, extra: Partial<typeof order.$inferInsert> = {}) {
	return async ({ db, cast }: World): Promise<Arranged> => {
		const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
		const { id: quoteId } = await insertQuote(db, { commissionId: id, tailorId: cast.tailor.id!, priceMinor: 33_000 });
		const { orderId } = await awardQuote(db, { commissionId: id, quoteId, customerId: cast.owner.id! });
		const now = new Date();
		await db
			.update(order)
			.set({
				status,
				...(status === 'awaiting_payment' ? {} : { fundedAt: now }),
				...(status === 'delivered' ? { deliveredAt: now, deliveryMethod: 'pickup', autoReleaseAt: now } : {}),
				...extra
			})
			.where(eq(order.id, orderId));
		return { orderId, status, secrets: [] };
	};
}

/** A funded order with a materials advance whose fabric the tailor has shown with a photo. */
async function fabricShown(world: World): Promise<Arranged> {
	const arranged = await orderIn('funded', { advanceMinor: 6_000 })(world);
	await world.db.insert(progressStep).values({
		orderId: arranged.orderId,
		kind: 'fabric_sourced',
		photoKey: `orders/${arranged.orderId}/fabric.jpg`,
		photoWidth: 800,
		photoHeight: 600,
		postedById: world.cast.tailor.id
	});
	return arranged;
}

/** Nobody but the allowed party moved the order. */
async function unmoved({ db }: World, { orderId, status }: Arranged) {
	const [row] = await db
		.select({ status: order.status, release: order.releaseRequestedAt, alteration: order.alterationRequestedAt })
		.from(order)
		.where(eq(order.id, orderId));
	expect(row).toEqual({ status, release: null, alteration: null });
	const steps = await db.select().from(progressStep).where(eq(progressStep.orderId, orderId));
	expect(steps.filter((s) => s.kind !== 'fabric_sourced')).toEqual([]);
}

const tailorOnly = (ok: number): Expectations => ({
	anonymous: 401,
	owner: 403,
	otherCustomer: 404,
	tailor: ok,
	tailorOnboarding: 404,
	admin: 403,
	suspended: 401
});

const customerOnly = (ok: number): Expectations => ({
	anonymous: 401,
	owner: ok,
	otherCustomer: 404,
	tailor: 403,
	tailorOnboarding: 404,
	admin: 403,
	suspended: 401
});

const path = (orderId: string, action: string) => `/api/v1/orders/${orderId}/${action}`;

export const orderLifecycleRows: Row<Arranged>[] = [
	{
		name: 'POST /api/v1/orders/{id}/progress',
		arrange: orderIn('funded'),
		send: (client, { orderId }) => client.json('POST', path(orderId, 'progress'), { step: 'cutting', note: 'Cut.' }),
		expect: tailorOnly(201),
		unchanged: unmoved
	},
	{
		name: 'POST /api/v1/orders/{id}/deliver',
		arrange: orderIn('in_work'),
		send: (client, { orderId }) => client.json('POST', path(orderId, 'deliver'), { method: 'pickup' }),
		expect: tailorOnly(200),
		unchanged: unmoved
	},
	{
		name: 'POST /api/v1/orders/{id}/confirm',
		arrange: orderIn('delivered'),
		send: (client, { orderId }) => client.json('POST', path(orderId, 'confirm')),
		expect: customerOnly(202),
		unchanged: unmoved
	},
	{
		name: 'POST /api/v1/orders/{id}/alteration',
		arrange: orderIn('delivered'),
		send: (client, { orderId }) =>
			client.json('POST', path(orderId, 'alteration'), { note: 'The hem is 2 cm too long.' }),
		expect: customerOnly(200),
		unchanged: unmoved
	},
	{
		name: 'POST /api/v1/orders/{id}/fabric-approval',
		arrange: fabricShown,
		send: (client, { orderId }) => client.json('POST', path(orderId, 'fabric-approval')),
		expect: customerOnly(202),
		unchanged: async (world, arranged) => {
			await unmoved(world, arranged);
			const [row] = await world.db
				.select({ approved: order.fabricApprovedAt })
				.from(order)
				.where(eq(order.id, arranged.orderId));
			expect(row.approved).toBeNull();
		}
	},
	{
		name: 'POST /api/v1/orders/{id}/cancel (unpaid)',
		arrange: orderIn('awaiting_payment'),
		send: (client, { orderId }) => client.json('POST', path(orderId, 'cancel'), { reason: 'Plans changed.' }),
		expect: { ...customerOnly(200), tailor: 200, admin: 200 },
		unchanged: unmoved
	},
	{
		name: 'POST /api/v1/orders/{id}/cancel (paid: by agreement)',
		arrange: orderIn('funded'),
		send: (client, { orderId }) => client.json('POST', path(orderId, 'cancel')),
		expect: { ...customerOnly(200), tailor: 200 },
		unchanged: unmoved
	}
];
