// Notices through the built server: a quote becomes a mail (text and HTML) and an in-app notice; preferences
// per event and channel; the list page, its paging and mark-read; and the JSON API.
import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { notification } from '../../src/lib/server/db/schema';
import * as notifications from '../../src/lib/server/notifications';
import { createCommission, createUser, type Person } from '../factories';
import { createQuotingWorkroom } from '../factories/quotes';
import { testDb } from './db';
import { baseUrl, callJson, newClient, signedIn, type Client } from './http';
import { mailTo, settledMailTo, waitForMail } from './inbox';

// notify() is called here as a domain function would call it; it reads ORIGIN.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = testDb();
afterAll(() => pool.end());
process.env.ORIGIN ??= baseUrl;

const day = 86_400_000;
const later = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);
const inboxUrl = process.env.MAIL_INBOX_URL;

type StoredMail = { id: string; to: string[]; subject: string; text: string; html: string | null };

/** The stand-in keeps each mail's HTML part too. */
async function fullMailTo(address: string): Promise<StoredMail[]> {
	const response = await fetch(`${inboxUrl}/messages?to=${encodeURIComponent(address.toLowerCase())}`);
	return (await response.json()) as StoredMail[];
}

function terms() {
	return {
		priceMinor: 18500,
		currency: 'EUR',
		deliveryDate: later(30),
		fittings: 2,
		fabricIncluded: true,
		message: 'A note only the commission page shows.',
		validUntil: later(10)
	};
}

async function openCommission(customer: Person, title = `Linen shirt ${Math.random().toString(36).slice(2, 8)}`) {
	const commission = await createCommission(db, {
		customerId: customer.id,
		title,
		dateNeeded: later(60),
		expiresAt: new Date(Date.now() + 20 * day)
	});
	return { ...commission, title };
}

async function sendQuote(commissionId: string) {
	const tailor = await createQuotingWorkroom(db);
	const client = await signedIn(tailor);
	const sent = await callJson(client, 'POST', `/api/v1/commissions/${commissionId}/quotes`, terms());
	expect(sent.status).toBe(201);
	return tailor;
}

async function notices(client: Client, query = '') {
	const page = await callJson(client, 'GET', `/api/v1/notifications${query}`);
	expect(page.status).toBe(200);
	return page.body;
}

/** `count` notices for one person, oldest first, each a moment apart. */
async function seedNotices(userId: string, count: number) {
	for (let i = 0; i < count; i += 1)
		await db.transaction((tx) =>
			notifications.notify(tx, {
				userId,
				event: 'progress_posted',
				title: `Step ${i + 1}`,
				body: `Step ${i + 1} is done.`,
				href: `/notifications?step=${i + 1}`
			})
		);
}

describe('a quote as a notice', () => {
	it('mails the customer in text and HTML, with the preferences link, and shows it under the bell', async () => {
		const customer = await createUser(db, { name: 'Morwenna <b>Tregear</b>' });
		const commission = await openCommission(customer, `Shirt <i>& tie</i> ${Math.random().toString(36).slice(2, 6)}`);
		const tailor = await sendQuote(commission.id);

		const received = await waitForMail(customer.email, {
			subject: `A new quote for “${commission.title}” from ${tailor.shopName}`
		});
		expect(received.text).toContain('Price: €185, fabric included');
		expect(received.text).toContain(`/commissions/${commission.id}`);
		expect(received.text).toContain('/account/notifications');
		expect(received.text).not.toContain('A note only the commission page shows.');

		const [full] = await fullMailTo(customer.email);
		expect(full.html).not.toBeNull();
		const html = full.html!;
		expect(html).toContain('&lt;i&gt;&amp; tie&lt;/i&gt;');
		expect(html).not.toContain('<i>& tie</i>');
		expect(html).toContain('Hello Morwenna');
		expect(html).toMatch(/href="http[^"]+\/account\/notifications"/);
		expect(html).toMatch(new RegExp(`href="http[^"]+/commissions/${commission.id}"`));
		expect(html).toContain('Compare quotes');
		expect(html).not.toContain('Poppins');
		expect(html).not.toContain('A note only the commission page shows.');

		const client = await signedIn(customer);
		const page = await notices(client);
		expect(page.unreadCount).toBe(1);
		expect(page.items).toHaveLength(1);
		expect(page.items[0]).toMatchObject({
			event: 'quote_received',
			title: `A new quote for “${commission.title}” from ${tailor.shopName}`,
			href: `/commissions/${commission.id}`,
			read: false,
			readAt: null
		});
		const home = await (await client.get('/commissions')).text();
		expect(home).toContain('Notifications, 1 unread');
	});
});

describe('preferences', () => {
	it('start on, turn a channel off per event, and keep money and meetings always on', async () => {
		const customer = await createUser(db);
		const client = await signedIn(customer);
		const start = await callJson(client, 'GET', '/api/v1/account/notification-preferences');
		expect(start.status).toBe(200);
		const events = start.body.events as { event: string; email: boolean; inApp: boolean; required: string | null }[];
		expect(events.every((e) => e.email && e.inApp)).toBe(true);
		expect(events.map((e) => e.event)).toContain('quote_received');
		expect(events.map((e) => e.event)).not.toContain('quote_accepted');
		expect(events.map((e) => e.event)).not.toContain('money_stuck');
		expect(events.find((e) => e.event === 'payment_received')?.required).toBe('money');
		expect(events.find((e) => e.event === 'fitting_booked')?.required).toBe('meeting');

		const refused = await callJson(client, 'PUT', '/api/v1/account/notification-preferences', {
			events: [
				{ event: 'quote_received', email: false },
				{ event: 'payment_received', email: false }
			]
		});
		expect(refused.status).toBe(422);
		expect(refused.body.error.code).toBe('always_sent');
		expect(refused.body.error.issues[0].path).toBe('events.1');
		const notMine = await callJson(client, 'PUT', '/api/v1/account/notification-preferences', {
			events: [{ event: 'money_stuck', inApp: false }]
		});
		expect(notMine.status).toBe(422);
		const unchanged = await callJson(client, 'GET', '/api/v1/account/notification-preferences');
		expect(unchanged.body).toEqual(start.body);

		for (const bad of [{ events: [{ event: 'nonsense' }] }, { events: 'all' }, { events: [], extra: 1 }]) {
			const answer = await callJson(client, 'PUT', '/api/v1/account/notification-preferences', bad);
			expect(answer.status).toBe(400);
			expect(answer.body.error.code).toBe('invalid_input');
		}

		// Mail off: the quote shows in the app only.
		const saved = await callJson(client, 'PUT', '/api/v1/account/notification-preferences', {
			events: [{ event: 'quote_received', email: false }]
		});
		expect(saved.status).toBe(200);
		expect(saved.body.events.find((e: { event: string }) => e.event === 'quote_received')).toMatchObject({
			email: false,
			inApp: true
		});
		const first = await openCommission(customer);
		await sendQuote(first.id);
		expect((await notices(client)).items).toHaveLength(1);
		expect(await settledMailTo(customer.email)).toHaveLength(0);

		// Both off: nothing at all; other events are untouched.
		await callJson(client, 'PUT', '/api/v1/account/notification-preferences', {
			events: [{ event: 'quote_received', inApp: false }]
		});
		const second = await openCommission(customer);
		await sendQuote(second.id);
		expect((await notices(client)).items).toHaveLength(1);
		expect(await settledMailTo(customer.email)).toHaveLength(0);
		await db.transaction((tx) =>
			notifications.notify(tx, {
				userId: customer.id,
				event: 'payment_received',
				title: 'Payment received for a test',
				body: 'Money is always told.',
				href: '/commissions'
			})
		);
		await waitForMail(customer.email, { subject: 'Payment received for a test' });
		expect((await notices(client)).items).toHaveLength(2);
	});

	it('are saved by the settings form, where unticked boxes are off and required ones cannot be sent', async () => {
		const customer = await createUser(db);
		const client = await signedIn(customer);
		const page = await client.get('/account/notifications');
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('Always sent');
		expect(html).toContain('name="quote_received.email"');
		expect(html).not.toContain('name="payment_received.email"');

		// Only the in-app box of `progress_posted` ticked: every other optional channel goes off.
		const saved = await client.post('/account/notifications?/save', { 'progress_posted.in_app': 'on' });
		expect(saved.status).toBe(200);
		const after = await callJson(client, 'GET', '/api/v1/account/notification-preferences');
		const byEvent = Object.fromEntries(
			(after.body.events as { event: string; email: boolean; inApp: boolean; required: string | null }[]).map((e) => [
				e.event,
				e
			])
		);
		expect(byEvent.progress_posted).toMatchObject({ email: false, inApp: true });
		expect(byEvent.quote_received).toMatchObject({ email: false, inApp: false });
		expect(byEvent.refunded).toMatchObject({ email: true, inApp: true });

		const forged = await client.post('/account/notifications?/save', { 'refunded.email': 'on' });
		expect(forged.status).toBe(400);
		const odd = await client.post('/account/notifications?/save', { 'progress_posted.email': 'yes' });
		expect(odd.status).toBe(400);
		const anonymous = await newClient().post('/account/notifications?/save', {});
		expect(anonymous.status).toBe(303);
	});
});

describe('the list', () => {
	it('pages newest first with More, and marks one or all read', async () => {
		const person = await createUser(db);
		await seedNotices(person.id, 23);
		const client = await signedIn(person);

		const first = await notices(client);
		expect(first.items.map((n: { title: string }) => n.title).slice(0, 2)).toEqual(['Step 23', 'Step 22']);
		expect(first.items).toHaveLength(20);
		expect(first.unreadCount).toBe(23);
		const second = await notices(client, `?cursor=${first.nextCursor}`);
		expect(second.items.map((n: { title: string }) => n.title)).toEqual(['Step 3', 'Step 2', 'Step 1']);
		expect(second.nextCursor).toBeNull();
		expect((await callJson(client, 'GET', '/api/v1/notifications?limit=0')).status).toBe(400);

		const html = await (await client.get('/notifications')).text();
		expect(html).toContain('Step 23');
		expect(html).not.toContain('Step 1 is done.');
		expect(html).toContain(`/notifications?after=${first.nextCursor}`);
		const older = await (await client.get(`/notifications?after=${first.nextCursor}`)).text();
		expect(older).toContain('Step 1');
		expect((await client.get('/notifications?after=not-an-id')).status).toBe(400);

		// Someone else's notice cannot be marked or opened.
		const stranger = await createUser(db);
		await seedNotices(stranger.id, 1);
		const [theirs] = await db
			.select({ id: notification.id })
			.from(notification)
			.where(eq(notification.userId, stranger.id));
		const ignored = await callJson(client, 'POST', '/api/v1/notifications/read', { ids: [theirs.id] });
		expect(ignored.body).toEqual({ marked: 0, unreadCount: 23 });
		expect((await client.post('/notifications?/open', { id: theirs.id })).status).toBe(404);

		const one = await callJson(client, 'POST', '/api/v1/notifications/read', { ids: [first.items[0].id] });
		expect(one.body).toEqual({ marked: 1, unreadCount: 22 });
		const opened = await client.post('/notifications?/open', { id: first.items[1].id });
		expect(opened.status).toBe(303);
		expect(opened.headers.get('location')).toBe('/notifications?step=22');
		expect((await notices(client)).unreadCount).toBe(21);

		for (const bad of [{}, { all: false }, { ids: [] }, { ids: ['x'] }, { ids: [first.items[0].id], all: true }]) {
			const answer = await callJson(client, 'POST', '/api/v1/notifications/read', bad);
			expect(answer.status).toBe(400);
			expect(answer.body.error.code).toBe('invalid_input');
		}

		expect((await client.post('/notifications?/readAll', {})).status).toBe(200);
		expect((await notices(client)).unreadCount).toBe(0);
		const all = await callJson(client, 'POST', '/api/v1/notifications/read', { all: true });
		expect(all.body).toEqual({ marked: 0, unreadCount: 0 });
		expect((await notices(client, '?limit=1')).items[0].read).toBe(true);
	});

	it('shows an empty state, and refuses to point a notice outside Tackline', async () => {
		const person = await createUser(db);
		const client = await signedIn(person);
		const html = await (await client.get('/notifications')).text();
		expect(html).toContain('Nothing to tell you yet');

		for (const href of ['//evil.example/x', 'https://evil.example', '/\\evil.example', 'javascript:alert(1)'])
			await expect(
				db.transaction((tx) =>
					notifications.notify(tx, { userId: person.id, event: 'delivered', title: 'x', body: 'x', href })
				)
			).rejects.toThrow(/inside Tackline/);
		expect((await notices(client)).items).toHaveLength(0);
		expect(await mailTo(person.email)).toHaveLength(0);
	});

	it('groups a digest into one mail with an in-app notice for each thing it covers', async () => {
		const person = await createUser(db, { name: 'Jory Pascoe' });
		const digest = (extra: string) =>
			db.transaction((tx) =>
				notifications.notifyGrouped(tx, {
					userId: person.id,
					event: 'message_waiting',
					title: `Messages are waiting ${extra}`,
					body: 'Two conversations have unread messages.',
					href: '/messages',
					notices: [
						{ title: 'A message from Gull Yard', body: '1 new message.', href: '/messages/a' },
						{ title: '2 messages from Old Quay', body: '2 new messages.', href: '/messages/b' }
					]
				})
			);
		await digest('(first)');
		await waitForMail(person.email, { subject: 'Messages are waiting (first)' });
		const client = await signedIn(person);
		const page = await notices(client);
		expect(page.items.map((n: { href: string }) => n.href).sort()).toEqual(['/messages/a', '/messages/b']);

		// With the mail off, the in-app notices still come, and no second mail.
		await callJson(client, 'PUT', '/api/v1/account/notification-preferences', {
			events: [{ event: 'message_waiting', email: false }]
		});
		await digest('(second)');
		expect((await notices(client)).items).toHaveLength(4);
		expect(await settledMailTo(person.email)).toHaveLength(1);
	});

	it('sends money_stuck to administrators only', async () => {
		const customer = await createUser(db);
		const admin = await createUser(db, { role: 'admin' });
		for (const userId of [customer.id, admin.id])
			await db.transaction((tx) =>
				notifications.notify(tx, {
					userId,
					event: 'money_stuck',
					title: 'A release needs a person',
					body: 'It failed every retry.',
					href: '/desk'
				})
			);
		expect((await notices(await signedIn(admin))).items).toHaveLength(1);
		expect((await notices(await signedIn(customer))).items).toHaveLength(0);
		await waitForMail(admin.email, { subject: 'A release needs a person' });
		expect(await mailTo(customer.email)).toHaveLength(0);
	});
});
