import PgBoss from 'pg-boss';
import { and, eq, inArray } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { auditEvent, messageThread, quote } from '../../src/lib/server/db/schema';
import { createCommission, createUser, createWorkroom, type Person } from '../factories';
import { createQuote, createQuotingWorkroom } from '../factories/quotes';
import { testDb } from './db';
import { newClient, signIn, type Client } from './http';
import { settledMailTo, waitForMail } from './inbox';
import { eventually } from './mail';

const { db, pool } = testDb();
afterAll(() => pool.end());

const day = 86_400_000;
const later = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);

async function signedIn(person: Person) {
	const client = newClient();
	expect((await signIn(client, person.email, person.password)).status).toBe(303);
	return client;
}

/** A JSON call whose body is read loosely: each test asserts the shape it relies on. */
async function api(client: Client, method: string, path: string, body?: unknown) {
	const response = await client.json(method, path, body);
	const text = await response.text();
	// eslint-disable-next-line @typescript-eslint/no-explicit-any
	return { status: response.status, body: (text ? JSON.parse(text) : null) as Record<string, any> };
}

function terms(overrides: Record<string, unknown> = {}) {
	return {
		priceMinor: 18500,
		currency: 'EUR',
		deliveryDate: later(30),
		fittings: 2,
		fabricIncluded: true,
		message: 'Mid-grey flannel from my usual mill; two fittings at the workroom on Old Quay.',
		validUntil: later(10),
		...overrides
	};
}

/** An open commission (needed in 60 days, open for 20 more) with its signed-in owner and a ready tailor. */
async function scene(options: { dateNeeded?: string } = {}) {
	const customer = await createUser(db, { name: 'Morwenna Tregear' });
	const title = `Flannel skirt ${Math.random().toString(36).slice(2, 8)}`;
	const commission = await createCommission(db, {
		customerId: customer.id,
		title,
		dateNeeded: options.dateNeeded ?? later(60),
		expiresAt: new Date(Date.now() + 20 * day)
	});
	const tailor = await createQuotingWorkroom(db);
	return {
		customer,
		commission,
		title,
		tailor,
		owner: await signedIn(customer),
		quoting: await signedIn(tailor),
		url: `/api/v1/commissions/${commission.id}/quotes`
	};
}

const quotesOn = (commissionId: string) => db.select().from(quote).where(eq(quote.commissionId, commissionId));

describe('sending a quote', () => {
	it('answers 201 with the quote, opens the thread, records it and tells the customer', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms());
		expect(sent.status).toBe(201);
		expect(sent.body).toMatchObject({
			commissionId: s.commission.id,
			tailorId: s.tailor.id,
			status: 'sent',
			priceMinor: 18500,
			currency: 'EUR',
			fittings: 2,
			fabricIncluded: true,
			deliveryDate: later(30),
			warnings: []
		});
		expect(sent.body.validUntil).toBe(`${later(10)}T23:59:59.999Z`);

		const threads = await db
			.select()
			.from(messageThread)
			.where(and(eq(messageThread.commissionId, s.commission.id), eq(messageThread.tailorId, s.tailor.id)));
		expect(threads).toHaveLength(1);
		const events = await db
			.select()
			.from(auditEvent)
			.where(eq(auditEvent.subjectId, sent.body.id as string));
		expect(events.map((e) => e.action)).toEqual(['quote.sent']);

		const mail = await waitForMail(s.customer.email, {
			subject: `A new quote for “${s.title}” from ${s.tailor.shopName}`
		});
		expect(mail.text).toContain('Price: €185, fabric included');
		expect(mail.text).toContain('Fittings included: 2');
		expect(mail.text).toContain(`/commissions/${s.commission.id}`);

		const one = await api(s.owner, 'GET', `/api/v1/quotes/${sent.body.id}`);
		expect(one.status).toBe(200);
		expect(one.body.id).toBe(sent.body.id);
	});

	it('warns, without refusing, when delivery comes after the date needed', async () => {
		const s = await scene({ dateNeeded: later(20) });
		const sent = await api(s.quoting, 'POST', s.url, terms({ deliveryDate: later(25) }));
		expect(sent.status).toBe(201);
		expect(sent.body.warnings.map((w: { code: string }) => w.code)).toEqual(['after_date_needed']);
	});

	it('refuses a second live quote from the same tailor with 409', async () => {
		const s = await scene();
		expect((await api(s.quoting, 'POST', s.url, terms())).status).toBe(201);
		const again = await api(s.quoting, 'POST', s.url, terms({ priceMinor: 17000 }));
		expect(again.status).toBe(409);
		expect(again.body.error.code).toBe('conflict');
		expect(await quotesOn(s.commission.id)).toHaveLength(1);
	});

	it('lets the owner see every quote and each tailor only their own', async () => {
		const s = await scene();
		const other = await createQuotingWorkroom(db);
		const otherClient = await signedIn(other);
		await api(s.quoting, 'POST', s.url, terms());
		await api(otherClient, 'POST', s.url, terms({ priceMinor: 21000 }));

		const owners = await api(s.owner, 'GET', s.url);
		expect(owners.status).toBe(200);
		expect(owners.body.items.map((q: { tailorId: string }) => q.tailorId).sort()).toEqual(
			[s.tailor.id, other.id].sort()
		);
		const mine = await api(otherClient, 'GET', s.url);
		expect(mine.body.items.map((q: { tailorId: string }) => q.tailorId)).toEqual([other.id]);
		const stranger = await signedIn(await createUser(db));
		expect((await api(stranger, 'GET', s.url)).status).toBe(404);
	});
});

describe('changing and withdrawing', () => {
	it('edits a waiting quote, tells the customer, and refuses anyone else', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms());
		const path = `/api/v1/quotes/${sent.body.id}`;
		const edited = await api(s.quoting, 'PATCH', path, { priceMinor: 17900, fittings: 1 });
		expect(edited.status).toBe(200);
		expect(edited.body).toMatchObject({ priceMinor: 17900, fittings: 1, status: 'sent', message: sent.body.message });
		await waitForMail(s.customer.email, { subject: `${s.tailor.shopName} changed their quote for “${s.title}”` });

		const stranger = await signedIn(await createQuotingWorkroom(db));
		expect((await api(stranger, 'PATCH', path, { priceMinor: 100 })).status).toBe(404);
		expect((await api(s.owner, 'PATCH', path, { priceMinor: 100 })).status).toBe(403);
		const [row] = await quotesOn(s.commission.id);
		expect(row.priceMinor).toBe(17900);
	});

	it('withdraws once, answers the same on a retry, refuses edits after, and allows a new quote', async () => {
		const s = await scene();
		const sent = await api(s.quoting, 'POST', s.url, terms());
		const withdrawn = await api(s.quoting, 'POST', `/api/v1/quotes/${sent.body.id}/withdraw`);
		expect(withdrawn.status).toBe(200);
		expect(withdrawn.body.status).toBe('withdrawn');
		expect(withdrawn.body.decidedAt).not.toBeNull();
		const retry = await api(s.quoting, 'POST', `/api/v1/quotes/${sent.body.id}/withdraw`);
		expect(retry.status).toBe(200);
		expect(retry.body.decidedAt).toBe(withdrawn.body.decidedAt);
		await waitForMail(s.customer.email, { subject: `${s.tailor.shopName} withdrew their quote for “${s.title}”` });

		expect((await api(s.quoting, 'PATCH', `/api/v1/quotes/${sent.body.id}`, { priceMinor: 100 })).status).toBe(409);

		const again = await api(s.quoting, 'POST', s.url, terms({ priceMinor: 19900 }));
		expect(again.status).toBe(201);
		const history = await api(s.owner, 'GET', s.url);
		expect(history.body.items.map((q: { status: string }) => q.status)).toEqual(['sent', 'withdrawn']);
		const events = await db
			.select({ action: auditEvent.action })
			.from(auditEvent)
			.where(eq(auditEvent.subjectId, sent.body.id as string));
		expect(events.map((e) => e.action).sort()).toEqual(['quote.sent', 'quote.withdrawn']);
	});
});

describe('refusals', () => {
	it('answers 400 for each invalid field and writes nothing at all', async () => {
		const s = await scene();
		const bad: [string, Record<string, unknown>][] = [
			['priceMinor', terms({ priceMinor: 0 })],
			['priceMinor', terms({ priceMinor: 12.5 })],
			['priceMinor', terms({ priceMinor: 100_000_001 })],
			['currency', terms({ currency: 'EURO' })],
			['currency', terms({ currency: 'USD' })],
			['deliveryDate', terms({ deliveryDate: later(0) })],
			['deliveryDate', terms({ deliveryDate: '2027-02-30' })],
			['validUntil', terms({ validUntil: later(-1) })],
			['validUntil', terms({ validUntil: later(40) })],
			['fittings', terms({ fittings: 11 })],
			['fittings', terms({ fittings: -1 })],
			['message', terms({ message: 'x'.repeat(4001) })],
			['fabricIncluded', terms({ fabricIncluded: 'yes' })],
			['', { ...terms(), discount: 10 }]
		];
		for (const [path, body] of bad) {
			const refused = await api(s.quoting, 'POST', s.url, body);
			expect(refused.status, JSON.stringify(body).slice(0, 120)).toBe(400);
			expect(refused.body.error.issues.map((i: { path: string }) => i.path)).toContain(path);
		}
		expect(await quotesOn(s.commission.id)).toHaveLength(0);
		const threads = await db.select().from(messageThread).where(eq(messageThread.commissionId, s.commission.id));
		expect(threads).toHaveLength(0);
		expect(await settledMailTo(s.customer.email, 500)).toEqual([]);
	});

	it('refuses a tailor who has not finished onboarding, and customers', async () => {
		const s = await scene();
		const starting = await signedIn(await createWorkroom(db, { onboarded: false }));
		const unfinished = await api(starting, 'POST', s.url, terms());
		expect(unfinished.status).toBe(403);
		expect(unfinished.body.error.message).toContain('Finish setting up your workroom');
		// The factory's plain workroom lacks a bio, lead times and a portfolio: not ready either.
		const partly = await signedIn(await createWorkroom(db));
		expect((await api(partly, 'POST', s.url, terms())).status).toBe(403);
		expect((await api(s.owner, 'POST', s.url, terms())).status).toBe(403);
		expect((await api(newClient(), 'POST', s.url, terms())).status).toBe(401);
		expect(await quotesOn(s.commission.id)).toHaveLength(0);
	});

	it('refuses quotes on commissions that are not open', async () => {
		const s = await scene();
		const awarded = await createCommission(db, { status: 'awarded' });
		const draft = await createCommission(db, { status: 'draft' });
		const onAwarded = await api(s.quoting, 'POST', `/api/v1/commissions/${awarded.id}/quotes`, terms());
		expect(onAwarded.status).toBe(409);
		expect((await api(s.quoting, 'POST', `/api/v1/commissions/${draft.id}/quotes`, terms())).status).toBe(404);
		const missing = '00000000-0000-4000-8000-000000000000';
		expect((await api(s.quoting, 'POST', `/api/v1/commissions/${missing}/quotes`, terms())).status).toBe(404);
		const rows = await db
			.select()
			.from(quote)
			.where(inArray(quote.commissionId, [awarded.id, draft.id]));
		expect(rows).toHaveLength(0);
	});
});

describe('the quote page', () => {
	it('shows the helper with its working and sends a quote without JavaScript', async () => {
		const s = await scene();
		const page = await s.quoting.get(`/commissions/${s.commission.id}/quote`);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('Quote helper');
		expect(html).toContain('Mark-up on fabric');
		expect(html).toContain('6 h × 28.00 EUR');

		const invalid = await s.quoting.post(`/commissions/${s.commission.id}/quote?/send`, {
			price: '0',
			deliveryDate: later(30),
			fittings: '1',
			fabricIncluded: 'on',
			message: 'Lined, with a back vent.',
			validUntil: later(10)
		});
		expect(invalid.status).toBe(400);
		expect(await quotesOn(s.commission.id)).toHaveLength(0);

		const posted = await s.quoting.post(`/commissions/${s.commission.id}/quote?/send`, {
			price: '192.50',
			deliveryDate: later(30),
			fittings: '1',
			fabricIncluded: 'on',
			message: 'Lined, with a back vent.',
			validUntil: later(10)
		});
		expect(posted.status).toBe(303);
		expect(posted.headers.get('location')).toBe(`/commissions/${s.commission.id}/quote?sent=1`);
		const [row] = await quotesOn(s.commission.id);
		expect(row).toMatchObject({ priceMinor: 19250, fittingsIncluded: 1, fabricIncluded: true, status: 'sent' });

		const withdrawn = await s.quoting.post(`/commissions/${s.commission.id}/quote?/withdraw`);
		expect(withdrawn.status).toBe(303);
		const [after] = await quotesOn(s.commission.id);
		expect(after.status).toBe('withdrawn');

		const list = await s.quoting.get('/workroom/quotes');
		expect(list.status).toBe(200);
		expect(await list.text()).toContain(s.title);
	});
});

describe('lapsing', () => {
	it('lapses quotes past their valid-until date through the scheduled job and tells the tailor', async () => {
		const s = await scene();
		const old = await createQuote(db, {
			commissionId: s.commission.id,
			tailorId: s.tailor.id,
			validUntil: new Date(Date.now() - 60_000)
		});
		const other = await createQuotingWorkroom(db);
		const fresh = await createQuote(db, { commissionId: s.commission.id, tailorId: other.id });
		const { rows } = await pool.query(`select cron from pgboss.schedule where name = 'quote-lapse'`);
		expect(rows).toHaveLength(1);

		// Run it now rather than wait for the schedule: the app's worker takes the job as it would a scheduled one.
		const boss = new PgBoss({ connectionString: process.env.DATABASE_URL });
		const run = () => boss.send('quote-lapse', {}, { db: { executeSql: (text, values) => pool.query(text, values) } });
		await run();
		await eventually(async () => {
			const [row] = await db.select({ status: quote.status }).from(quote).where(eq(quote.id, old.id));
			return row.status === 'lapsed';
		});
		const mail = await waitForMail(s.tailor.email, { subject: `Your quote for “${s.title}” has lapsed` });
		expect(mail.text).toContain('has lapsed');
		await run();
		expect((await settledMailTo(s.tailor.email)).length).toBe(1);
		const [stillSent] = await db.select({ status: quote.status }).from(quote).where(eq(quote.id, fresh.id));
		expect(stillSent.status).toBe('sent');

		// The tailor may quote again once the old one has lapsed.
		expect((await api(s.quoting, 'POST', s.url, terms())).status).toBe(201);
	});
});
