/**
 * Comparing and accepting quotes, the customer's side: one acceptance makes one order whose fee and payout add
 * up to the price, declines every other live quote (each tailor told), awards the commission, and from then on
 * only the awarded tailor — of all tailors — reads the full measurements.
 */
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
	auditEvent,
	commission,
	commissionMeasurements,
	order,
	quote,
	searchOutbox
} from '../../src/lib/server/db/schema';
import { createCommission, createUser, createWorkroom, type Person, type Workroom } from '../factories';
import { insertQuote } from '../factories/quotes';
import { testDb } from './db';
import { newClient, signIn, type Client } from './http';
import { settledMailTo, waitForMail } from './inbox';

// The acceptance reads the fee rate through the app's settings module.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
afterAll(() => pool.end());

async function signedIn(person: Person) {
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

async function call(client: Client, method: string, path: string, body?: unknown) {
	const response = await client.json(method, path, body);
	const text = await response.text();
	// Read loosely: each test asserts the shape it relies on.
	// eslint-disable-next-line @typescript-eslint/no-explicit-any
	return { status: response.status, body: (text ? JSON.parse(text) : null) as Record<string, any> };
}

/** A customer with an open commission (measurements frozen) and `n` onboarded workrooms quoting on it. */
async function quotedCommission(n: number, priceOf = (i: number) => 45_000 + i * 1000) {
	const customer = await createUser(db, { name: 'Morwenna Tregarthen' });
	const made = await createCommission(db, {
		customerId: customer.id,
		status: 'open',
		dateNeeded: new Date(Date.now() + 60 * 86_400_000).toISOString().slice(0, 10)
	});
	// Everything the straight skirt's draft needs, so the awarded tailor's page can draw it.
	await db
		.update(commissionMeasurements)
		.set({ valuesMm: { waist_girth: 740, hip_girth: 1000, waist_to_hip: 205 } })
		.where(eq(commissionMeasurements.commissionId, made.id));
	const tailors: Workroom[] = [];
	for (let i = 0; i < n; i++) tailors.push(await createWorkroom(db));
	const quotes = [];
	for (const [i, tailor] of tailors.entries())
		quotes.push(await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, priceMinor: priceOf(i) }));
	return { customer, commissionId: made.id, title: made.title, tailors, quotes, client: await signedIn(customer) };
}

const statusOf = async (id: string) =>
	(await db.select({ status: quote.status, reason: quote.declineReason }).from(quote).where(eq(quote.id, id)))[0];

describe('accepting a quote', () => {
	let world: Awaited<ReturnType<typeof quotedCommission>>;
	let accepted: Awaited<ReturnType<typeof call>>;

	beforeAll(async () => {
		// €456.78: 10 % is 4 567.8 cents, rounded half up to 4 568.
		world = await quotedCommission(3, (i) => [45_678, 52_000, 49_000][i]);
		accepted = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/accept`);
	});

	it('makes one order awaiting payment whose fee and payout add up to the price', async () => {
		expect(accepted.status, JSON.stringify(accepted.body)).toBe(201);
		expect(accepted.body).toMatchObject({
			status: 'awaiting_payment',
			quoteId: world.quotes[0].id,
			commissionId: world.commissionId,
			tailorId: world.tailors[0].id,
			priceMinor: 45_678,
			platformFeeMinor: 4568,
			tailorPayoutMinor: 41_110,
			platformFeeBasisPoints: 1000,
			currency: 'EUR',
			dueDate: world.quotes[0].deliveryDate
		});
		const rows = await db.select().from(order).where(eq(order.commissionId, world.commissionId));
		expect(rows).toHaveLength(1);
		expect(rows[0].id).toBe(accepted.body.orderId);
		expect(rows[0].platformFeeMinor + rows[0].tailorPayoutMinor).toBe(rows[0].priceMinor);
		expect(rows[0].status).toBe('awaiting_payment');
	});

	it('declines every other quote, tells each tailor and awards the commission', async () => {
		expect(await statusOf(world.quotes[0].id)).toMatchObject({ status: 'accepted' });
		for (const other of world.quotes.slice(1))
			expect(await statusOf(other.id)).toEqual({ status: 'declined', reason: 'another quote was accepted' });
		expect(accepted.body.declinedQuoteIds.sort()).toEqual(
			world.quotes
				.slice(1)
				.map((q) => q.id)
				.sort()
		);
		const [row] = await db
			.select({ status: commission.status })
			.from(commission)
			.where(eq(commission.id, world.commissionId));
		expect(row.status).toBe('awarded');
		const outbox = await db
			.select()
			.from(searchOutbox)
			.where(and(eq(searchOutbox.kind, 'commission'), eq(searchOutbox.entityId, world.commissionId)));
		expect(outbox.length).toBeGreaterThan(0);

		const won = await waitForMail(world.tailors[0].email, { subject: `Your quote for “${world.title}” was accepted` });
		expect(won.text).toContain('€456.78');
		expect(won.text).toContain('€45.68');
		expect(won.text).toContain('€411.10');
		for (const other of world.tailors.slice(1))
			await waitForMail(other.email, { subject: `“${world.title}” went to another workroom` });
	});

	it('records who did it', async () => {
		const events = await db
			.select({ action: auditEvent.action, subjectId: auditEvent.subjectId, actorId: auditEvent.actorId })
			.from(auditEvent)
			.where(eq(auditEvent.actorId, world.customer.id));
		const actions = events.map((e) => `${e.action} ${e.subjectId}`);
		expect(actions).toContain(`quote.accepted ${world.quotes[0].id}`);
		expect(actions).toContain(`order.created ${accepted.body.orderId}`);
		expect(actions).toContain(`commission.awarded ${world.commissionId}`);
		for (const other of world.quotes.slice(1)) expect(actions).toContain(`quote.declined ${other.id}`);
	});

	it('refuses a second acceptance with 409 and a clear message, and changes nothing', async () => {
		const again = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[1].id}/accept`);
		expect(again.status).toBe(409);
		expect(again.body.error.code).toBe('conflict');
		expect(again.body.error.message).toMatch(/no longer open.*another quote has already been accepted/);
		const same = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/accept`);
		expect(same.status).toBe(409);
		expect(same.body.error.message).toMatch(/already accepted this quote/);
		expect(await db.select().from(order).where(eq(order.commissionId, world.commissionId))).toHaveLength(1);
	});

	it('gives the awarded tailor the measurements, and no other tailor', async () => {
		const winner = await call(await signedIn(world.tailors[0]), 'GET', `/api/v1/commissions/${world.commissionId}`);
		expect(winner.status).toBe(200);
		expect(winner.body.measurements).toEqual({
			unit: 'cm',
			values: { waist_girth: 74, hip_girth: 100, waist_to_hip: 20.5 }
		});

		const loser = await call(await signedIn(world.tailors[1]), 'GET', `/api/v1/commissions/${world.commissionId}`);
		expect(loser.status).toBe(200);
		expect(loser.body).not.toHaveProperty('measurements');
		expect(JSON.stringify(loser.body)).not.toMatch(/waist_girth"?:\s*7/);

		const stranger = await call(
			await signedIn(await createWorkroom(db)),
			'GET',
			`/api/v1/commissions/${world.commissionId}`
		);
		expect(stranger.status).toBe(404);
	});

	it('shows the awarded tailor the measurements, the cutting draft and the fabric layout', async () => {
		const tailor = await signedIn(world.tailors[0]);
		const first = await tailor.get(`/commissions/${world.commissionId}`);
		expect(first.status).toBe(200);
		const firstHtml = await first.text();
		expect(firstHtml).toContain('Full measurements');
		// The first view does not wait for the nesting: the page says it is working (and, with JavaScript, asks
		// again); it is not stored, so the next view, once the draft is worked out, has the draft in the page.
		expect(firstHtml).toContain('data-testid="draft-pending"');
		expect(first.headers.get('cache-control')).toContain('no-store');
		let html = firstHtml;
		for (let tries = 0; tries < 60 && html.includes('data-testid="draft-pending"'); tries++) {
			await new Promise((resolve) => setTimeout(resolve, 250));
			const again = await tailor.get(`/commissions/${world.commissionId}`);
			expect(again.status).toBe(200);
			html = await again.text();
		}
		expect(html).not.toContain('data-testid="draft-pending"');
		expect(html).toContain('Cutting draft');
		expect(html).toContain('Fabric to buy');
		// Pieces with their lines to mark, and the fabric length to buy.
		expect(html).toMatch(/data-line="[\w-]+\.[\w-]+"/);
		expect(html).toContain('data-testid="fabric-length"');
	});

	it('shows the owner who won and that payment comes next', async () => {
		const html = await (await world.client.get(`/commissions/${world.commissionId}`)).text();
		expect(html).toContain(`Awarded to ${world.tailors[0].shopName}`);
		expect(html).toContain('awaiting payment');
		expect(html).toContain('€456.78');
	});
});

describe('twenty simultaneous acceptances on one commission', () => {
	it('make exactly one order; the other nineteen get 409', async () => {
		const world = await quotedCommission(20);
		const answers = await Promise.all(
			world.quotes.map((q) => call(world.client, 'POST', `/api/v1/quotes/${q.id}/accept`))
		);
		const statuses = answers.map((a) => a.status);
		expect(statuses.filter((s) => s === 201)).toHaveLength(1);
		expect(statuses.filter((s) => s === 409)).toHaveLength(19);
		for (const refused of answers.filter((a) => a.status === 409)) expect(refused.body.error.code).toBe('conflict');
		const orders = await db.select().from(order).where(eq(order.commissionId, world.commissionId));
		expect(orders).toHaveLength(1);
		const winner = answers.find((a) => a.status === 201)!.body;
		expect(orders[0].quoteId).toBe(winner.quoteId);
		const states = await db
			.select({ status: quote.status })
			.from(quote)
			.where(eq(quote.commissionId, world.commissionId));
		expect(states.filter((s) => s.status === 'accepted')).toHaveLength(1);
		expect(states.filter((s) => s.status === 'declined')).toHaveLength(19);
	});
});

describe('declining a quote', () => {
	it('declines with a reason the tailor is mailed, and answers the quote', async () => {
		const world = await quotedCommission(2);
		const reason = 'The delivery date is too late for the wedding.';
		const declined = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/decline`, { reason });
		expect(declined.status).toBe(200);
		expect(declined.body).toMatchObject({
			id: world.quotes[0].id,
			status: 'declined',
			declineReason: reason,
			priceMinor: world.quotes[0].priceMinor
		});
		const mail = await waitForMail(world.tailors[0].email, { subject: `Your quote for “${world.title}” was declined` });
		expect(mail.text).toContain(reason);
		// The other quote is untouched and the commission still open.
		expect(await statusOf(world.quotes[1].id)).toMatchObject({ status: 'sent' });

		// Declining again changes nothing; a declined quote cannot be accepted.
		const again = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/decline`);
		expect(again.status).toBe(200);
		expect(again.body.declineReason).toBe(reason);
		expect((await settledMailTo(world.tailors[0].email, 800)).length).toBe(1);
		const late = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/accept`);
		expect(late.status).toBe(409);
		expect(late.body.error.message).toMatch(/was declined/);
	});

	it('declines without a reason', async () => {
		const world = await quotedCommission(1);
		const declined = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/decline`);
		expect(declined.status).toBe(200);
		expect(declined.body.declineReason).toBe('');
		const mail = await waitForMail(world.tailors[0].email, { subject: `Your quote for “${world.title}” was declined` });
		expect(mail.text).toContain('They gave no reason.');
	});

	it('refuses bad input with 400 and changes nothing', async () => {
		const world = await quotedCommission(1);
		const path = `/api/v1/quotes/${world.quotes[0].id}/decline`;
		const long = await call(world.client, 'POST', path, { reason: 'x'.repeat(501) });
		expect(long.status).toBe(400);
		expect(long.body.error.issues[0].path).toBe('reason');
		expect((await call(world.client, 'POST', path, { reason: 5 })).status).toBe(400);
		expect((await call(world.client, 'POST', path, { why: 'no' })).status).toBe(400);
		expect((await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/accept`, { now: 1 })).status).toBe(
			400
		);
		expect(await statusOf(world.quotes[0].id)).toMatchObject({ status: 'sent' });
	});
});

describe('what cannot be accepted', () => {
	it('refuses a quote past its valid-until date', async () => {
		const world = await quotedCommission(0);
		const tailor = await createWorkroom(db);
		const stale = await insertQuote(db, {
			commissionId: world.commissionId,
			tailorId: tailor.id,
			validUntil: new Date(Date.now() - 60_000)
		});
		const answer = await call(world.client, 'POST', `/api/v1/quotes/${stale.id}/accept`);
		expect(answer.status).toBe(409);
		expect(answer.body.error.message).toMatch(/valid until .*fresh one/);
	});

	it('refuses a quote on a cancelled commission', async () => {
		const world = await quotedCommission(1);
		await db.update(commission).set({ status: 'cancelled' }).where(eq(commission.id, world.commissionId));
		const answer = await call(world.client, 'POST', `/api/v1/quotes/${world.quotes[0].id}/accept`);
		expect(answer.status).toBe(409);
		expect(answer.body.error.message).toMatch(/it was cancelled/);
	});

	it('tells someone else’s customer nothing and tailors no', async () => {
		const world = await quotedCommission(1);
		const path = `/api/v1/quotes/${world.quotes[0].id}/accept`;
		expect((await call(await signedIn(await createUser(db)), 'POST', path)).status).toBe(404);
		expect((await call(await signedIn(world.tailors[0]), 'POST', path)).status).toBe(403);
		expect((await call(newClient(), 'POST', path)).status).toBe(401);
		expect(await statusOf(world.quotes[0].id)).toMatchObject({ status: 'sent' });
	});
});

describe('the commission page', () => {
	it('compares the quotes, with the best-fit hint and its working', async () => {
		const world = await quotedCommission(2, (i) => [61_000, 48_000][i]);
		const html = await (await world.client.get(`/commissions/${world.commissionId}`)).text();
		expect(html).toContain('Compare quotes');
		expect(html).toContain(world.tailors[0].shopName);
		expect(html).toContain(world.tailors[1].shopName);
		expect(html).toContain(`${world.tailors[1].shopName} fits best`);
		expect(html).toContain('How the best fit is worked out');
	});

	it('declines and accepts through the form actions, confirming first', async () => {
		const world = await quotedCommission(2);
		const page = `/commissions/${world.commissionId}`;
		const declined = await world.client.post(`${page}?/decline`, {
			quoteId: world.quotes[1].id,
			reason: 'Too far for fittings.'
		});
		expect(declined.status).toBe(303);
		expect(await statusOf(world.quotes[1].id)).toEqual({ status: 'declined', reason: 'Too far for fittings.' });

		const confirm = await (await world.client.get(`${page}?accept=${world.quotes[0].id}`)).text();
		expect(confirm).toContain('Accept this quote?');
		expect(confirm).toContain('Payment comes next');

		const accepted = await world.client.post(`${page}?/accept`, { quoteId: world.quotes[0].id });
		expect(accepted.status).toBe(303);
		expect(accepted.headers.get('location')).toBe(`${page}?accepted=1`);
		expect(await statusOf(world.quotes[0].id)).toMatchObject({ status: 'accepted' });

		const again = await world.client.post(`${page}?/accept`, { quoteId: world.quotes[1].id });
		expect(again.status).toBe(409);
		expect(await again.text()).toContain('no longer open');
	});
});
