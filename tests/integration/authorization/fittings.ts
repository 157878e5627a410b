/**
 * Fittings: the order's tailor offers times, withdraws them and marks fittings done; the order's customer books and
 * cancels; both read the list, the page and the calendar file. Admins read the list and the page (settling a
 * dispute needs them) and change nothing; the calendar file is the two people's. Nobody else — other customers,
 * tailors taking no part — learns the order or its fittings exist. In these rows `tailor` is the order's tailor
 * and `tailorOnboarding` a tailor with no part in it.
 */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { fitting, order } from '../../../src/lib/server/db/schema';
import { createCommission } from '../../factories';
import { awardQuote, insertQuote } from '../../factories/quotes';
import { signInRedirect, suspendedRedirect, type Expectations, type Row, type World } from './matrix';

type Arranged = { orderId: string; fittingId: string; status: string; secrets: string[] };

const hour = 3_600_000;

/** A paid order of the owner's with `cast.tailor`, and one fitting three days ahead in the state asked for. */
function withFitting(status: 'proposed' | 'confirmed', startsInHours = 72) {
	return async ({ db, cast }: World): Promise<Arranged> => {
		const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
		const { id: quoteId } = await insertQuote(db, { commissionId: id, tailorId: cast.tailor.id! });
		const { orderId } = await awardQuote(db, { commissionId: id, quoteId, customerId: cast.owner.id! });
		await db.update(order).set({ status: 'funded', fundedAt: new Date() }).where(eq(order.id, orderId));
		const startsAt = new Date(Date.now() + startsInHours * hour);
		const [row] = await db
			.insert(fitting)
			.values({
				orderId,
				proposedById: cast.tailor.id!,
				startsAt,
				endsAt: new Date(startsAt.getTime() + 45 * 60_000),
				timeZone: 'Europe/London',
				status,
				bookedAt: status === 'confirmed' ? new Date() : null
			})
			.returning({ id: fitting.id });
		return { orderId, fittingId: row.id, status, secrets: [] };
	};
}

async function unchanged({ db }: World, { fittingId, status }: Arranged) {
	const [row] = await db.select({ status: fitting.status }).from(fitting).where(eq(fitting.id, fittingId));
	expect(row.status).toBe(status);
}

/** Either party reads; everyone else finds nothing (a calendar file is the two people's, so admins too). */
const partiesOnly = (ok: number): Expectations => ({
	anonymous: 401,
	owner: ok,
	otherCustomer: 404,
	tailor: ok,
	tailorOnboarding: 404,
	admin: 404,
	suspended: 401
});

const partiesPage = (ok: number): Expectations => ({
	...partiesOnly(ok),
	anonymous: signInRedirect,
	suspended: suspendedRedirect
});

export const fittingRows: Row<Arranged>[] = [
	{
		name: 'GET /api/v1/orders/{id}/fittings',
		arrange: withFitting('proposed'),
		send: (client, { orderId }) => client.json('GET', `/api/v1/orders/${orderId}/fittings`),
		expect: { ...partiesOnly(200), admin: 200 }
	},
	{
		name: 'POST /api/v1/orders/{id}/fittings',
		arrange: withFitting('proposed'),
		send: (client, { orderId }) =>
			client.json('POST', `/api/v1/orders/${orderId}/fittings`, {
				slots: [{ start: '2031-05-06T10:00', durationMinutes: 30 }]
			}),
		expect: { ...partiesOnly(403), otherCustomer: 403, tailor: 201, tailorOnboarding: 404, admin: 403 },
		unchanged: async ({ db }, { orderId }) => {
			const rows = await db.select({ id: fitting.id }).from(fitting).where(eq(fitting.orderId, orderId));
			expect(rows).toHaveLength(1);
		}
	},
	{
		name: 'POST /api/v1/fittings/{id}/book',
		arrange: withFitting('proposed'),
		send: (client, { fittingId }) => client.json('POST', `/api/v1/fittings/${fittingId}/book`),
		expect: { ...partiesOnly(403), owner: 200, otherCustomer: 404, tailorOnboarding: 403, admin: 403 },
		unchanged
	},
	{
		name: 'POST /api/v1/fittings/{id}/cancel',
		arrange: withFitting('confirmed'),
		send: (client, { fittingId }) =>
			client.json('POST', `/api/v1/fittings/${fittingId}/cancel`, { reason: 'A clash in the diary' }),
		expect: { ...partiesOnly(200), admin: 403 },
		unchanged
	},
	{
		name: 'POST /api/v1/fittings/{id}/done',
		arrange: withFitting('confirmed', -1),
		send: (client, { fittingId }) => client.json('POST', `/api/v1/fittings/${fittingId}/done`),
		expect: { ...partiesOnly(403), otherCustomer: 403, tailor: 200, tailorOnboarding: 404, admin: 403 },
		unchanged
	},
	{
		name: 'GET /orders/{id}/fittings',
		arrange: withFitting('proposed'),
		send: (client, { orderId }) => client.get(`/orders/${orderId}/fittings`),
		expect: { ...partiesPage(200), admin: 200 }
	},
	{
		name: 'POST /orders/{id}/fittings?/book',
		arrange: withFitting('proposed'),
		send: (client, { orderId, fittingId }) => client.post(`/orders/${orderId}/fittings?/book`, { fittingId }),
		expect: { ...partiesPage(403), owner: 200, otherCustomer: 404, tailorOnboarding: 403, admin: 403 },
		unchanged
	},
	{
		name: 'POST /orders/{id}/fittings?/cancel',
		arrange: withFitting('confirmed'),
		send: (client, { orderId, fittingId }) =>
			client.post(`/orders/${orderId}/fittings?/cancel`, { fittingId, reason: 'A clash in the diary' }),
		expect: { ...partiesPage(200), admin: 403 },
		unchanged
	},
	{
		name: 'POST /orders/{id}/fittings?/offer',
		arrange: withFitting('proposed'),
		send: (client, { orderId }) =>
			client.post(`/orders/${orderId}/fittings?/offer`, {
				timeZone: 'Europe/London',
				durationMinutes: '30',
				placeKind: 'workroom',
				date_0: '2031-05-07',
				time_0: '11:00'
			}),
		expect: { ...partiesPage(403), otherCustomer: 403, tailor: 200, tailorOnboarding: 404, admin: 403 }
	},
	{
		name: 'POST /orders/{id}/fittings?/done',
		arrange: withFitting('confirmed', -1),
		send: (client, { orderId, fittingId }) => client.post(`/orders/${orderId}/fittings?/done`, { fittingId }),
		expect: { ...partiesPage(403), otherCustomer: 403, tailor: 200, tailorOnboarding: 404, admin: 403 },
		unchanged
	},
	{
		name: 'GET /orders/{id}/fittings/{fittingId}/calendar.ics',
		arrange: withFitting('confirmed'),
		send: (client, { orderId, fittingId }) => client.get(`/orders/${orderId}/fittings/${fittingId}/calendar.ics`),
		expect: partiesPage(200)
	}
];
