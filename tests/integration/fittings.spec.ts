/**
 * Fittings end to end through the built server: the tailor offers times in London, the customer in New York books
 * one and sees it in their own zone, both are mailed, the calendar file reads back with its zone and UID, the
 * reminder job mails each of them once however often it runs, and changes stop at the cut-off.
 */
import { eq } from 'drizzle-orm';
import { DateTime } from 'luxon';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { fitting, user } from '../../src/lib/server/db/schema';
import { sendDueReminders } from '../../src/lib/server/fittings';
import { createFundedOrder, type FundedOrder } from '../factories/fittings';
import { createUser } from '../factories';
import { find, parseIcs, prop } from '../factories/ics';
import { testDb } from './db';
import { callJson, signedIn, type Client } from './http';
import { settledMailTo, waitForMail } from './inbox';

// The reminder job is run from here against this file's database; links in its mail need the public origin.
vi.mock('$env/dynamic/private', () => ({ env: { ...process.env, ORIGIN: process.env.TACKLINE_BASE_URL } }));

const { db, pool } = testDb();
afterAll(() => pool.end());

const hour = 3_600_000;

/** A wall-clock start `days` from now at `time` in London, as the tailor types it. */
function londonStart(days: number, time = '10:00') {
	const [h, m] = time.split(':').map(Number);
	return DateTime.now()
		.setZone('Europe/London')
		.plus({ days })
		.set({ hour: h, minute: m, second: 0, millisecond: 0 })
		.toFormat("yyyy-MM-dd'T'HH:mm");
}

let o: FundedOrder;
let tailor: Client;
let customer: Client;

beforeAll(async () => {
	o = await createFundedOrder(db, { tailorZone: 'Europe/London', customerZone: 'America/New_York' });
	[tailor, customer] = await Promise.all([signedIn(o.tailor), signedIn(o.customer)]);
});

async function offerTimes(starts: string[], extra: Record<string, unknown> = {}) {
	const answer = await callJson(tailor, 'POST', `/api/v1/orders/${o.orderId}/fittings`, {
		slots: starts.map((start) => ({ start, durationMinutes: 45, ...extra }))
	});
	expect(answer.status, JSON.stringify(answer.body)).toBe(201);
	return answer.body.items as { id: string; startsAt: string; when: string[] }[];
}

describe('offer, book, calendar and reminder', () => {
	it('runs from the offer to one reminder each', async () => {
		const [first, second] = await offerTimes([londonStart(3), londonStart(4)]);
		expect(first.when[0]).toMatch(/\(Europe\/London\)$/);
		await waitForMail(o.customer.email, { subject: `${o.tailor.shopName} offered 2 fitting times` });

		const listed = await callJson(customer, 'GET', `/api/v1/orders/${o.orderId}/fittings`);
		expect(listed.status).toBe(200);
		expect(listed.body.cutoffHours).toBe(24);
		const seen = listed.body.items.find((f: { id: string }) => f.id === first.id);
		expect(seen.when[0]).toMatch(/\(America\/New York\)$/);
		expect(seen.when[1]).toMatch(/\(Europe\/London\)$/);
		expect(seen.timeZone).toBe('Europe/London');

		const booked = await callJson(customer, 'POST', `/api/v1/fittings/${first.id}/book`);
		expect(booked.status).toBe(200);
		expect(booked.body).toMatchObject({ id: first.id, status: 'confirmed' });
		// Again: the same answer, nothing new sent.
		expect((await callJson(customer, 'POST', `/api/v1/fittings/${first.id}/book`)).body.status).toBe('confirmed');

		for (const email of [o.customer.email, o.tailor.email]) {
			const mails = (await settledMailTo(email)).filter((m) => m.subject.startsWith('Fitting booked'));
			expect(mails).toHaveLength(1);
			expect(mails[0].text).toContain('a parent or guardian present');
			expect(mails[0].text).toContain('/fittings');
		}

		const file = await customer.get(`/orders/${o.orderId}/fittings/${first.id}/calendar.ics`);
		expect(file.status).toBe(200);
		expect(file.headers.get('content-type')).toContain('text/calendar');
		const calendar = find(parseIcs(await file.text()), 'VCALENDAR')!;
		expect(prop(calendar, 'METHOD')?.value).toBe('REQUEST');
		const event = find(calendar, 'VEVENT')!;
		expect(prop(event, 'UID')?.value).toBe(`fitting-${first.id}@localhost`);
		expect(prop(event, 'DTSTART')).toMatchObject({
			params: { TZID: 'Europe/London' },
			value: londonStart(3).replaceAll('-', '').replace(':', '') + '00'
		});
		expect(prop(find(calendar, 'VTIMEZONE')!, 'TZID')?.value).toBe('Europe/London');
		const stranger = await signedIn(await createUser(db));
		expect((await stranger.get(`/orders/${o.orderId}/fittings/${first.id}/calendar.ics`)).status).toBe(404);
		// An open time has no calendar file yet.
		expect((await customer.get(`/orders/${o.orderId}/fittings/${second.id}/calendar.ics`)).status).toBe(404);

		// The job, run twice at once and once more: one reminder each.
		const dayBefore = new Date(new Date(first.startsAt).getTime() - 20 * hour);
		await Promise.all([sendDueReminders(db, { now: dayBefore }), sendDueReminders(db, { now: dayBefore })]);
		await sendDueReminders(db, { now: dayBefore });
		for (const email of [o.customer.email, o.tailor.email]) {
			await waitForMail(email, { subject: undefined });
			const reminders = (await settledMailTo(email, 2500)).filter((m) => m.subject.startsWith('Fitting reminder'));
			expect(reminders, email).toHaveLength(1);
		}
		const [row] = await db.select({ remindedAt: fitting.remindedAt }).from(fitting).where(eq(fitting.id, first.id));
		expect(row.remindedAt?.toISOString()).toBe(dayBefore.toISOString());
	});
});

describe('moving and cancelling up to the cut-off', () => {
	it('moves and cancels before it, and says to message the tailor after it', async () => {
		const [a, b, c] = await offerTimes([londonStart(6), londonStart(7), londonStart(8)]);
		expect((await callJson(customer, 'POST', `/api/v1/fittings/${a.id}/book`)).status).toBe(200);
		const moved = await callJson(customer, 'POST', `/api/v1/fittings/${b.id}/book`);
		expect(moved.body.status).toBe('confirmed');
		const list = await callJson(customer, 'GET', `/api/v1/orders/${o.orderId}/fittings`);
		expect(list.body.items.find((f: { id: string }) => f.id === a.id).status).toBe('proposed');

		// Pull the booked time to 23 hours away: inside the cut-off.
		const soon = new Date(Date.now() + 23 * hour);
		await db
			.update(fitting)
			.set({ startsAt: soon, endsAt: new Date(soon.getTime() + 45 * 60_000) })
			.where(eq(fitting.id, b.id));
		const lateCancel = await callJson(customer, 'POST', `/api/v1/fittings/${b.id}/cancel`);
		expect(lateCancel.status).toBe(409);
		expect(lateCancel.body.error.code).toBe('too_late');
		expect(lateCancel.body.error.message).toContain('Message the other person');
		const lateMove = await callJson(customer, 'POST', `/api/v1/fittings/${c.id}/book`);
		expect(lateMove.status).toBe(409);
		const page = await customer.get(`/orders/${o.orderId}/fittings`);
		expect(await page.text()).toContain('can no longer be booked, moved or cancelled here');

		// The tailor may still cancel, with a reason the customer is told.
		const bare = await callJson(tailor, 'POST', `/api/v1/fittings/${b.id}/cancel`);
		expect(bare.status).toBe(400);
		expect(bare.body.error.issues).toEqual([{ path: 'reason', message: 'Give a reason: the customer is told.' }]);
		const cancelled = await callJson(tailor, 'POST', `/api/v1/fittings/${b.id}/cancel`, {
			reason: 'The cloth is late'
		});
		expect(cancelled.body).toMatchObject({
			status: 'cancelled',
			cancelledBy: 'tailor',
			cancelReason: 'The cloth is late'
		});
		const told = await waitForMail(o.customer.email, { subject: undefined });
		expect(told).toBeTruthy();
		const notices = (await settledMailTo(o.customer.email)).filter((m) => m.subject.startsWith('Fitting cancelled'));
		expect(notices).toHaveLength(1);
		expect(notices[0].text).toContain('The cloth is late');

		// Well ahead of the cut-off, the customer cancels their own booking.
		expect((await callJson(customer, 'POST', `/api/v1/fittings/${c.id}/book`)).status).toBe(200);
		const own = await callJson(customer, 'POST', `/api/v1/fittings/${c.id}/cancel`, {});
		expect(own.body).toMatchObject({ status: 'cancelled', cancelledBy: 'customer' });
	});
});

describe('input', () => {
	it('answers bad offers with 4xx and the fields named', async () => {
		const url = `/api/v1/orders/${o.orderId}/fittings`;
		const empty = await callJson(tailor, 'POST', url, { slots: [] });
		expect(empty.status).toBe(400);
		expect(empty.body.error.issues[0]).toMatchObject({ path: 'slots', message: 'Offer at least one time.' });
		const long = await callJson(tailor, 'POST', url, { slots: [{ start: londonStart(9), durationMinutes: 200 }] });
		expect(long.body.error.issues).toEqual([
			{ path: 'slots.0.durationMinutes', message: 'A fitting takes at most 180 minutes.' }
		]);
		const home = await callJson(tailor, 'POST', url, {
			slots: [{ start: londonStart(9), durationMinutes: 30, placeKind: 'customer_home' }]
		});
		expect(home.status).toBe(400);
		const nowhere = await callJson(tailor, 'POST', url, {
			slots: [{ start: londonStart(9), durationMinutes: 30, placeKind: 'public_place' }]
		});
		expect(nowhere.body.error.issues[0].path).toBe('slots.0.address');
		const zone = await callJson(tailor, 'POST', url, {
			timeZone: 'Mars/Olympus',
			slots: [{ start: londonStart(9), durationMinutes: 30 }]
		});
		expect(zone.body.error.issues[0].path).toBe('timeZone');
		const past = await callJson(tailor, 'POST', url, { slots: [{ start: londonStart(-1), durationMinutes: 30 }] });
		expect(past.status).toBe(400);
		expect(past.body.error.issues[0].message).toContain('already passed');
		const text = await tailor.json('POST', url);
		expect(text.status).toBe(415);
		const reason = await callJson(customer, 'POST', `/api/v1/fittings/${crypto.randomUUID()}/cancel`, { reason: 7 });
		expect(reason.status).toBe(400);
		expect((await callJson(customer, 'POST', `/api/v1/fittings/${crypto.randomUUID()}/book`)).status).toBe(404);
	});

	it('keeps what was typed when the offer form is refused, and shows the meeting caution', async () => {
		const response = await tailor.post(`/orders/${o.orderId}/fittings?/offer`, {
			timeZone: 'Europe/London',
			durationMinutes: '45',
			placeKind: 'public_place',
			address: '',
			notes: 'Bring the shoes you will wear',
			date_0: londonStart(10).slice(0, 10),
			time_0: ''
		});
		expect(response.status).toBe(400);
		const html = await response.text();
		expect(html).toContain('Bring the shoes you will wear');
		expect(html).toContain('Add the time too.');
		expect(html).toContain('Name the public place and its address');
		expect(html).toContain('a parent or guardian present');
		const offered = await tailor.post(`/orders/${o.orderId}/fittings?/offer`, {
			timeZone: 'Europe/London',
			durationMinutes: '30',
			placeKind: 'workroom',
			date_0: londonStart(12).slice(0, 10),
			time_0: '15:30'
		});
		expect(offered.status).toBe(200);
		expect(await offered.text()).toContain('The time was offered');
	});
});

describe('an administrator', () => {
	it('reads the fittings, in their own zone, and changes nothing', async () => {
		const [open] = await offerTimes([londonStart(14, '09:30')]);
		const person = await createUser(db, { role: 'admin' });
		await db.update(user).set({ timeZone: 'Asia/Tokyo' }).where(eq(user.id, person.id));
		const admin = await signedIn(person);

		const listed = await callJson(admin, 'GET', `/api/v1/orders/${o.orderId}/fittings`);
		expect(listed.status).toBe(200);
		const seen = listed.body.items.find((f: { id: string }) => f.id === open.id);
		expect(seen.when[0]).toMatch(/\(Asia\/Tokyo\)$/);
		expect(seen.when.slice(1).join(' ')).toContain('Europe/London');
		expect(seen.when.slice(1).join(' ')).toContain('America/New York');

		const page = await admin.get(`/orders/${o.orderId}/fittings`);
		expect(page.status).toBe(200);
		const html = await page.text();
		expect(html).toContain('You are reading as an administrator');
		expect(html).not.toContain('Book this time');
		expect(html).not.toContain('Offer fitting times');
		expect(html).not.toContain('Withdraw this time');

		const book = await callJson(admin, 'POST', `/api/v1/fittings/${open.id}/book`);
		expect(book.status).toBe(403);
		const [row] = await db.select({ status: fitting.status }).from(fitting).where(eq(fitting.id, open.id));
		expect(row.status).toBe('proposed');

		const order = await admin.get(`/orders/${o.orderId}`);
		expect(order.status).toBe(200);
		expect(await order.text()).toContain(`/orders/${o.orderId}/fittings`);
	});
});
