/**
 * Paying for an order and reading it: only the order's customer pays (the API, and the page's form action);
 * either party and an admin read the order and its payment page; nobody else learns it exists. Payout set-up
 * belongs to tailors alone. In these rows `tailor` is the order's tailor, `tailorOnboarding` a tailor with no
 * part in it.
 */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { order } from '../../../src/lib/server/db/schema';
import { createCommission } from '../../factories';
import { awardQuote, insertQuote } from '../../factories/quotes';
import { signInRedirect, suspendedRedirect, tailorPage, type Expectations, type Row, type World } from './matrix';

type Ordered = { orderId: string; secrets: string[] };

/** An order of the owner's, awaiting payment, awarded to `cast.tailor`. */
async function unpaid({ db, cast }: World): Promise<Ordered> {
	const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
	const { id: quoteId } = await insertQuote(db, { commissionId: id, tailorId: cast.tailor.id!, priceMinor: 41_377 });
	const { orderId } = await awardQuote(db, { commissionId: id, quoteId, customerId: cast.owner.id! });
	return { orderId, secrets: [] };
}

/** Nobody but the customer started a payment. */
async function notStarted({ db }: World, { orderId }: Ordered) {
	const [row] = await db
		.select({ status: order.status, session: order.checkoutSessionId })
		.from(order)
		.where(eq(order.id, orderId));
	expect(row).toEqual({ status: 'awaiting_payment', session: null });
}

/** Either party or an admin reads; another customer and an uninvolved tailor find nothing. */
const partiesRead = (ok: number): Expectations => ({
	anonymous: 401,
	owner: ok,
	otherCustomer: 404,
	tailor: ok,
	tailorOnboarding: 404,
	admin: ok,
	suspended: 401
});

const toHostedPage = { status: 303, location: /^http:\/\/[^/]+\/c\/pay\/cs_/ };
const toOnboarding = { status: 303, location: /^http:\/\/[^/]+\/setup\/e\/acct_/ };

export const orderRows: Row<Ordered>[] = [
	{
		name: 'GET /api/v1/orders/{id}',
		arrange: unpaid,
		send: (client, { orderId }) => client.json('GET', `/api/v1/orders/${orderId}`),
		expect: partiesRead(200)
	},
	{
		name: 'POST /api/v1/orders/{id}/checkout',
		arrange: unpaid,
		send: (client, { orderId }) => client.json('POST', `/api/v1/orders/${orderId}/checkout`),
		expect: { ...partiesRead(403), owner: 201 },
		unchanged: notStarted
	},
	{
		name: 'GET /orders/{id}/paid',
		arrange: unpaid,
		send: (client, { orderId }) => client.get(`/orders/${orderId}/paid`),
		expect: { ...partiesRead(200), anonymous: signInRedirect, suspended: suspendedRedirect }
	},
	{
		name: 'POST /orders/{id}/paid?/pay',
		arrange: unpaid,
		send: (client, { orderId }) => client.post(`/orders/${orderId}/paid?/pay`),
		expect: {
			...partiesRead(403),
			owner: toHostedPage,
			anonymous: signInRedirect,
			suspended: suspendedRedirect
		},
		unchanged: notStarted
	},
	{
		name: 'GET /workroom/payouts',
		arrange: () => Promise.resolve({ orderId: '', secrets: [] }),
		send: (client) => client.get('/workroom/payouts'),
		expect: tailorPage(200)
	},
	{
		name: 'POST /workroom/payouts?/setUp',
		arrange: () => Promise.resolve({ orderId: '', secrets: [] }),
		send: (client) => client.post('/workroom/payouts?/setUp'),
		expect: tailorPage(toOnboarding)
	}
];
