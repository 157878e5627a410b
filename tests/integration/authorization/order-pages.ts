/**
 * The order page and what it does: the page, its progress photos and its form actions, and the lists that lead
 * to it. Either party and an admin read the order; nobody else learns it exists (404, as for a missing order).
 * Each action belongs to one side: the tailor posts progress, marks ready and delivered; the customer confirms,
 * asks for an alteration and approves fabric; either cancels. In these rows `tailor` is the order's tailor,
 * `tailorOnboarding` a tailor with no part in it.
 */
import { and, eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { auditEvent, order, progressStep, type OrderStatus } from '../../../src/lib/server/db/schema';
import type { ActorName } from './actors';
import { processUpload } from '../../../src/lib/server/photos/process';
import { storePhoto } from '../../../src/lib/server/photos/store';
import { createCommission } from '../../factories';
import { noisy } from '../../factories/images';
import { awardQuote, insertQuote } from '../../factories/quotes';
import {
	signInRedirect,
	suspendedRedirect,
	tailorPage,
	type Expectations,
	type Outcome,
	type Row,
	type World
} from './matrix';

type Ordered = { orderId: string; stepId: string; secrets: string[] };

/** An order of the owner's with `cast.tailor`, put in `status` directly (no money moves in these rows). */
function orderIn(status: OrderStatus, { photo = false } = {}) {
	return async ({ db, cast }: World): Promise<Ordered> => {
		const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
		const { id: quoteId } = await insertQuote(db, { commissionId: id, tailorId: cast.tailor.id!, priceMinor: 52_500 });
		const { orderId } = await awardQuote(db, { commissionId: id, quoteId, customerId: cast.owner.id! });
		const now = new Date();
		await db
			.update(order)
			.set({
				status,
				fundedAt: status === 'awaiting_payment' ? null : now,
				workStartedAt: ['in_work', 'ready', 'delivered'].includes(status) ? now : null,
				deliveredAt: status === 'delivered' ? now : null,
				deliveryMethod: status === 'delivered' ? 'pickup' : null
			})
			.where(eq(order.id, orderId));
		let stepId = '';
		if (photo) {
			const processed = await processUpload(new Uint8Array(await noisy(320, 240).jpeg().toBuffer()));
			const keys = await storePhoto(processed);
			const [step] = await db
				.insert(progressStep)
				.values({
					orderId,
					kind: 'cutting',
					note: 'Cut from the navy wool',
					photoKey: keys.key,
					photoThumbKey: keys.thumbKey,
					photoWidth: processed.width,
					photoHeight: processed.height,
					postedById: cast.tailor.id
				})
				.returning({ id: progressStep.id });
			stepId = step.id;
		}
		return { orderId, stepId, secrets: [] };
	};
}

/**
 * Nothing changed — unless by one of `allowed`: the matrix runs this after every refused attempt and after
 * those that redirect, so an allowed actor's own change is told apart by who the history says made it.
 */
function changedOnlyBy(status: OrderStatus, allowed: ActorName[]) {
	return async ({ db, cast }: World, { orderId }: Ordered) => {
		const [row] = await db.select({ status: order.status }).from(order).where(eq(order.id, orderId));
		const events = await db
			.select({ actorId: auditEvent.actorId, action: auditEvent.action })
			.from(auditEvent)
			.where(and(eq(auditEvent.subjectType, 'order'), eq(auditEvent.subjectId, orderId)));
		const steps = await db
			.select({ by: progressStep.postedById })
			.from(progressStep)
			.where(eq(progressStep.orderId, orderId));
		const allowedIds = allowed.map((name) => cast[name].id);
		const changes = events.filter((e) => e.action !== 'order.created');
		for (const event of changes) expect(allowedIds, `${event.action} by someone not allowed`).toContain(event.actorId);
		for (const step of steps) expect(allowedIds).toContain(step.by);
		if (changes.length === 0) expect(row.status).toBe(status);
	};
}

/** A page of the order, or one of its form actions: `ok` for whom it is meant, 403 for the other side. */
function orderAction(expectations: Partial<Pick<Expectations, 'owner' | 'tailor' | 'admin'>>): Expectations {
	return {
		anonymous: signInRedirect,
		owner: 403,
		otherCustomer: 404,
		tailor: 403,
		tailorOnboarding: 404,
		admin: 403,
		suspended: suspendedRedirect,
		...expectations
	};
}

const back = (path: RegExp): Outcome => ({ status: 303, location: path });
const done = (what: string) => back(new RegExp(`^/orders/[0-9a-f-]{36}\\?done=${what}$`));

export const orderPageRows: Row<Ordered>[] = [
	{
		name: 'GET /orders/{id}',
		arrange: orderIn('in_work'),
		send: (client, { orderId }) => client.get(`/orders/${orderId}`),
		expect: orderAction({ owner: 200, tailor: 200, admin: 200 })
	},
	{
		name: 'GET /orders/{id}/progress/{stepId}/thumb',
		arrange: orderIn('in_work', { photo: true }),
		send: (client, { orderId, stepId }) => client.get(`/orders/${orderId}/progress/${stepId}/thumb`),
		expect: orderAction({ owner: 200, tailor: 200, admin: 200 })
	},
	{
		name: 'GET /orders',
		arrange: () => Promise.resolve({ orderId: '', stepId: '', secrets: [] }),
		send: (client) => client.get('/orders'),
		expect: {
			anonymous: signInRedirect,
			owner: 200,
			otherCustomer: 200,
			tailor: back(/^\/workroom\/orders$/),
			tailorOnboarding: back(/^\/workroom\/orders$/),
			admin: 200,
			suspended: suspendedRedirect
		}
	},
	{
		name: 'GET /workroom/orders',
		arrange: () => Promise.resolve({ orderId: '', stepId: '', secrets: [] }),
		send: (client) => client.get('/workroom/orders'),
		expect: tailorPage(200)
	},
	{
		name: 'POST /orders/{id}?/progress',
		arrange: orderIn('funded'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/progress`, { step: 'cutting', note: 'Cut' }),
		expect: orderAction({ tailor: done('progress') }),
		unchanged: changedOnlyBy('funded', ['tailor'])
	},
	{
		name: 'POST /orders/{id}?/ready',
		arrange: orderIn('in_work'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/ready`),
		expect: orderAction({ tailor: done('ready') }),
		unchanged: changedOnlyBy('in_work', ['tailor'])
	},
	{
		name: 'POST /orders/{id}?/deliver',
		arrange: orderIn('ready'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/deliver`, { method: 'pickup', note: '' }),
		expect: orderAction({ tailor: done('delivered') }),
		unchanged: changedOnlyBy('ready', ['tailor'])
	},
	{
		name: 'POST /orders/{id}?/alteration',
		arrange: orderIn('delivered'),
		send: (client, { orderId }) =>
			client.post(`/orders/${orderId}?/alteration`, { note: 'Take the waist in a little' }),
		expect: orderAction({ owner: done('alteration') }),
		unchanged: changedOnlyBy('delivered', ['owner'])
	},
	{
		// On a paid order not yet delivered: the customer may confirm, but not yet (409); nobody else may at all.
		name: 'POST /orders/{id}?/confirm (before delivery)',
		arrange: orderIn('in_work'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/confirm`),
		expect: orderAction({ owner: 409 }),
		unchanged: changedOnlyBy('in_work', [])
	},
	{
		// Without a materials advance there is nothing to approve (409) — and only the customer is asked at all.
		name: 'POST /orders/{id}?/approveFabric (no advance)',
		arrange: orderIn('funded'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/approveFabric`),
		expect: orderAction({ owner: 409 }),
		unchanged: changedOnlyBy('funded', [])
	},
	{
		name: 'POST /orders/{id}?/cancel (unpaid)',
		arrange: orderIn('awaiting_payment'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/cancel`, { reason: '' }),
		expect: orderAction({ owner: done('cancelled'), tailor: done('cancelled'), admin: done('cancelled') }),
		unchanged: changedOnlyBy('awaiting_payment', ['owner', 'tailor', 'admin'])
	},
	{
		name: 'POST /orders/{id}?/declineCancel',
		arrange: orderIn('funded'),
		send: (client, { orderId }) => client.post(`/orders/${orderId}?/declineCancel`),
		expect: orderAction({ owner: done('cancel-declined'), tailor: done('cancel-declined') }),
		unchanged: changedOnlyBy('funded', ['owner', 'tailor'])
	}
];
