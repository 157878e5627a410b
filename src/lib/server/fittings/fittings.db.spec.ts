import { and, eq, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createFundedOrder, type FundedOrder } from '../../../../tests/factories/fittings';
import { find, parseIcs, prop } from '../../../../tests/factories/ics';
import { createUser } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { fitting, notification, order } from '../db/schema';
import { queueNames } from '../jobs';
import {
	book,
	calendarForParty,
	cancel,
	FittingError,
	listForOrder,
	markDone,
	offer,
	sendDueReminders,
	type Actor
} from '.';

vi.mock('$env/dynamic/private', () => ({
	env: { ...process.env, ORIGIN: 'http://localhost:5173', FITTING_CHANGE_CUTOFF_HOURS: '24' }
}));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 6 });
afterAll(() => pool.end());
beforeAll(async () => {
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

const hour = 3_600_000;
/** Every test runs "on" New Year's Day 2027 (UTC), so the dates below are always ahead. */
const newYear = new Date('2027-01-01T00:00:00Z');

const as = (person: { id: string }, role: Actor['role']): Actor => ({ id: person.id, role });
const tailorOf = (o: FundedOrder) => as(o.tailor, 'tailor');
const customerOf = (o: FundedOrder) => as(o.customer, 'customer');

async function refusal(promise: Promise<unknown>): Promise<FittingError> {
	const error = await promise.then(
		() => null,
		(e: unknown) => e
	);
	expect(error).toBeInstanceOf(FittingError);
	return error as FittingError;
}

async function noticesOf(userId: string, event: string) {
	return db
		.select({ title: notification.title, body: notification.body })
		.from(notification)
		.where(and(eq(notification.userId, userId), sql`${notification.event} = ${event}`));
}

async function mailsTo(email: string) {
	const { rows } = await pool.query<{
		data: { subject: string; attachments?: { content: string; contentType: string }[] };
	}>(`select data from pgboss.job where name = 'mail-send' and data->>'to' = $1 order by created_on`, [email]);
	return rows.map((r) => r.data);
}

const slot = (start: string, durationMinutes = 45) => ({
	start,
	durationMinutes,
	placeKind: 'workroom' as const,
	address: '',
	notes: ''
});

describe('offering times', () => {
	it('reads wall-clock times in the tailor’s zone and shows them to a customer in another zone, both named', async () => {
		const o = await createFundedOrder(db, { tailorZone: 'Europe/London', customerZone: 'America/New_York' });
		// 14 January: London is on GMT (UTC+0), New York on EST (UTC−5).
		const [row] = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-01-14T10:00')] },
			now: newYear
		});
		expect(row.startsAt.toISOString()).toBe('2027-01-14T10:00:00.000Z');
		expect(row.endsAt.toISOString()).toBe('2027-01-14T10:45:00.000Z');
		expect(row.timeZone).toBe('Europe/London');

		const seenByCustomer = await listForOrder(db, { orderId: o.orderId, actor: customerOf(o), now: newYear });
		const [view] = seenByCustomer.fittings;
		expect(view.when[0]).toMatch(/^Thu 14 Jan 2027, 05:00–05:45 .*\(America\/New York\)$/);
		expect(view.when[1]).toMatch(/^Thu 14 Jan 2027, 10:00–10:45 GMT \(Europe\/London\)$/);
		expect(view.localStart).toBe('2027-01-14T10:00');

		const seenByTailor = await listForOrder(db, { orderId: o.orderId, actor: tailorOf(o), now: newYear });
		expect(seenByTailor.fittings[0].when[0]).toMatch(/10:00–10:45 GMT \(Europe\/London\)$/);
		expect(seenByTailor.fittings[0].when[1]).toMatch(/05:00–05:45 .*\(America\/New York\)$/);

		const [offered] = await noticesOf(o.customer.id, 'fitting_offered');
		expect(offered.body).toContain('05:00–05:45');
	});

	it('follows each zone across the weeks when only America has changed its clocks', async () => {
		const o = await createFundedOrder(db, { tailorZone: 'Europe/London', customerZone: 'America/New_York' });
		// New York moves to EDT on 14 March 2027, London to BST on 28 March: on 20 March they are 4 hours apart,
		// on 1 April 5 hours again (both in summer time). Rules: the US and UK summer-time laws, from memory.
		const rows = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-03-20T10:00'), slot('2027-04-01T10:00')] },
			now: newYear
		});
		expect(rows.map((r) => r.startsAt.toISOString())).toEqual(['2027-03-20T10:00:00.000Z', '2027-04-01T09:00:00.000Z']);
		const { fittings } = await listForOrder(db, { orderId: o.orderId, actor: customerOf(o), now: newYear });
		expect(fittings[0].when[0]).toContain('06:00–06:45');
		expect(fittings[1].when[0]).toContain('05:00–05:45');
		expect(fittings[1].when[1]).toMatch(/10:00–10:45 BST \(Europe\/London\)$/);
	});

	it('refuses a time the clocks skip, a time in the past and overlapping times', async () => {
		const o = await createFundedOrder(db);
		const skipped = await refusal(
			offer(db, {
				orderId: o.orderId,
				actor: tailorOf(o),
				request: { slots: [slot('2027-03-28T01:30'), slot('2026-12-01T10:00')] },
				now: newYear
			})
		);
		expect(skipped.code).toBe('invalid');
		expect(skipped.issues.map((i) => i.path)).toEqual(['slots.0.start', 'slots.1.start']);
		expect(skipped.issues[0].message).toContain('clocks go forward');
		expect(skipped.issues[1].message).toContain('already passed');

		const together = await refusal(
			offer(db, {
				orderId: o.orderId,
				actor: tailorOf(o),
				request: { slots: [slot('2027-02-01T10:00', 60), slot('2027-02-01T10:30')] },
				now: newYear
			})
		);
		expect(together.issues).toEqual([{ path: 'slots.1.start', message: 'This time overlaps time 1 of this offer.' }]);

		await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-02-01T10:00')] },
			now: newYear
		});
		const clash = await refusal(
			offer(db, {
				orderId: o.orderId,
				actor: tailorOf(o),
				request: { slots: [slot('2027-02-01T10:30')] },
				now: newYear
			})
		);
		expect(clash.code).toBe('conflict');
		// Back to back is fine.
		await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-02-01T10:45')] },
			now: newYear
		});
	});

	it('is for the order’s tailor, on a paid order not yet delivered; others find no order', async () => {
		const o = await createFundedOrder(db);
		const request = { slots: [slot('2027-02-02T10:00')] };
		expect((await refusal(offer(db, { orderId: o.orderId, actor: customerOf(o), request, now: newYear }))).code).toBe(
			'forbidden'
		);
		const stranger = await createUser(db, { role: 'tailor' });
		expect(
			(await refusal(offer(db, { orderId: o.orderId, actor: as(stranger, 'tailor'), request, now: newYear }))).code
		).toBe('not_found');
		await db.update(order).set({ status: 'delivered' }).where(eq(order.id, o.orderId));
		expect((await refusal(offer(db, { orderId: o.orderId, actor: tailorOf(o), request, now: newYear }))).code).toBe(
			'wrong_status'
		);
	});
});

describe('booking, moving and cancelling', () => {
	it('books a time, mails both people the calendar file, and reminds them once the day before', async () => {
		const o = await createFundedOrder(db, { tailorZone: 'Europe/London', customerZone: 'America/New_York' });
		const [first, second] = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-01-20T15:00'), slot('2027-01-21T15:00')] },
			now: newYear
		});
		const booked = await book(db, { fittingId: first.id, actor: customerOf(o), now: newYear });
		expect(booked.status).toBe('confirmed');
		expect(booked.bookedAt?.toISOString()).toBe(newYear.toISOString());
		expect(booked.remindedAt).toBeNull();
		// Booking again changes nothing; the other time stays open.
		expect((await book(db, { fittingId: first.id, actor: customerOf(o), now: newYear })).bookedAt).toEqual(
			booked.bookedAt
		);
		const [other] = await db.select().from(fitting).where(eq(fitting.id, second.id));
		expect(other.status).toBe('proposed');

		for (const person of [o.customer, o.tailor]) {
			const notices = await noticesOf(person.id, 'fitting_booked');
			expect(notices).toHaveLength(1);
			expect(notices[0].body).toContain('a parent or guardian present');
			const mail = (await mailsTo(person.email)).find((m) => m.subject.startsWith('Fitting booked'));
			expect(mail?.attachments?.[0].contentType).toContain('method=REQUEST');
			const calendar = parseIcs(mail!.attachments![0].content);
			const event = find(find(calendar, 'VCALENDAR')!, 'VEVENT')!;
			expect(prop(event, 'DTSTART')).toEqual({
				name: 'DTSTART',
				params: { TZID: 'Europe/London' },
				value: '20270120T150000'
			});
		}
		expect((await noticesOf(o.customer.id, 'fitting_booked'))[0].title).toBe('Fitting booked: Wed 20 Jan, 10:00');

		// Two runs of the job at once and a third later: one reminder to each person.
		const dayBefore = new Date(first.startsAt.getTime() - 20 * hour);
		await Promise.all([sendDueReminders(db, { now: dayBefore }), sendDueReminders(db, { now: dayBefore })]);
		await sendDueReminders(db, { now: new Date(dayBefore.getTime() + hour) });
		for (const person of [o.customer, o.tailor]) expect(await noticesOf(person.id, 'fitting_reminder')).toHaveLength(1);
		const [reminded] = await db.select().from(fitting).where(eq(fitting.id, first.id));
		expect(reminded.remindedAt?.toISOString()).toBe(dayBefore.toISOString());
		// The open time that nobody booked gets no reminder.
		await sendDueReminders(db, { now: new Date(second.startsAt.getTime() - 2 * hour) });
		expect(await noticesOf(o.customer.id, 'fitting_reminder')).toHaveLength(1);
	});

	it('moves and cancels up to the cut-off, and refuses both after it', async () => {
		const o = await createFundedOrder(db);
		const [a, b, c] = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-02-10T10:00'), slot('2027-02-11T10:00'), slot('2027-02-12T10:00')] },
			now: newYear
		});
		await book(db, { fittingId: a.id, actor: customerOf(o), now: newYear });
		const moved = await book(db, { fittingId: b.id, actor: customerOf(o), now: newYear });
		expect(moved.status).toBe('confirmed');
		const [released] = await db.select().from(fitting).where(eq(fitting.id, a.id));
		expect(released).toMatchObject({ status: 'proposed', bookedAt: null });
		const movedMail = (await mailsTo(o.customer.email)).find((m) => m.subject.startsWith('Fitting moved'));
		expect(movedMail?.attachments?.map((f) => f.contentType.split('method=')[1])).toEqual(['REQUEST', 'CANCEL']);

		// 23 hours before b starts: too late to move away from it or cancel it online.
		const late = new Date(b.startsAt.getTime() - 23 * hour);
		const tooLateMove = await refusal(book(db, { fittingId: c.id, actor: customerOf(o), now: late }));
		expect(tooLateMove.code).toBe('too_late');
		expect(tooLateMove.message).toContain('Message the other person');
		expect((await refusal(cancel(db, { fittingId: b.id, actor: customerOf(o), now: late }))).code).toBe('too_late');
		const page = await listForOrder(db, { orderId: o.orderId, actor: customerOf(o), now: late });
		expect(page.fittings.find((f) => f.id === b.id)?.can).toMatchObject({ cancel: false });

		// 25 hours before, the customer may still cancel; the workroom is told with a CANCEL file.
		const cancelled = await cancel(db, {
			fittingId: b.id,
			actor: customerOf(o),
			request: { reason: 'Away that week' },
			now: new Date(b.startsAt.getTime() - 25 * hour)
		});
		expect(cancelled).toMatchObject({
			status: 'cancelled',
			cancelledById: o.customer.id,
			cancelReason: 'Away that week'
		});
		const [told] = await noticesOf(o.tailor.id, 'fitting_cancelled');
		expect(told.body).toContain('Away that week');
		// Cancelling again changes nothing.
		expect((await cancel(db, { fittingId: b.id, actor: customerOf(o), now: newYear })).status).toBe('cancelled');
	});

	it('lets the tailor withdraw open times, cancel a booking only with a reason, and mark it done once started', async () => {
		const o = await createFundedOrder(db);
		const [a, b] = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-03-01T10:00'), slot('2027-03-02T10:00')] },
			now: newYear
		});
		expect((await cancel(db, { fittingId: a.id, actor: tailorOf(o), now: newYear })).status).toBe('cancelled');
		expect((await refusal(book(db, { fittingId: a.id, actor: customerOf(o), now: newYear }))).code).toBe(
			'wrong_status'
		);
		expect((await refusal(book(db, { fittingId: b.id, actor: tailorOf(o), now: newYear }))).code).toBe('forbidden');
		await book(db, { fittingId: b.id, actor: customerOf(o), now: newYear });
		expect((await refusal(markDone(db, { fittingId: b.id, actor: tailorOf(o), now: newYear }))).code).toBe(
			'wrong_status'
		);
		const noReason = await refusal(cancel(db, { fittingId: b.id, actor: tailorOf(o), now: newYear }));
		expect(noReason.issues).toEqual([{ path: 'reason', message: 'Give a reason: the customer is told.' }]);
		const after = new Date(b.startsAt.getTime() + 10 * 60_000);
		expect((await markDone(db, { fittingId: b.id, actor: tailorOf(o), now: after })).status).toBe('done');
		expect((await markDone(db, { fittingId: b.id, actor: tailorOf(o), now: after })).status).toBe('done');
	});

	it('keeps one UID per fitting and bumps SEQUENCE with every change of its calendar file', async () => {
		const o = await createFundedOrder(db, { tailorZone: 'America/New_York', customerZone: 'Europe/London' });
		const [a] = await offer(db, {
			orderId: o.orderId,
			actor: tailorOf(o),
			request: { slots: [slot('2027-02-15T09:30', 30)] },
			now: newYear
		});
		expect((await refusal(calendarForParty(db, { fittingId: a.id, actor: customerOf(o) }))).code).toBe('not_found');
		await book(db, { fittingId: a.id, actor: customerOf(o), now: newYear });
		const booked = parseIcs((await calendarForParty(db, { fittingId: a.id, actor: customerOf(o) })).content);
		await cancel(db, { fittingId: a.id, actor: tailorOf(o), request: { reason: 'Unwell' }, now: newYear });
		const cancelled = parseIcs((await calendarForParty(db, { fittingId: a.id, actor: tailorOf(o) })).content);

		const calendarOf = (c: ReturnType<typeof parseIcs>) => find(c, 'VCALENDAR')!;
		const eventOf = (c: ReturnType<typeof parseIcs>) => find(calendarOf(c), 'VEVENT')!;
		expect(prop(calendarOf(booked), 'METHOD')?.value).toBe('REQUEST');
		expect(prop(calendarOf(cancelled), 'METHOD')?.value).toBe('CANCEL');
		expect(find(calendarOf(booked), 'VTIMEZONE') && prop(find(calendarOf(booked), 'VTIMEZONE')!, 'TZID')?.value).toBe(
			'America/New_York'
		);
		expect(prop(eventOf(booked), 'UID')?.value).toBe(`fitting-${a.id}@localhost`);
		expect(prop(eventOf(cancelled), 'UID')?.value).toBe(prop(eventOf(booked), 'UID')?.value);
		expect(prop(eventOf(booked), 'DTSTART')).toMatchObject({
			params: { TZID: 'America/New_York' },
			value: '20270215T093000'
		});
		expect(prop(eventOf(booked), 'DTEND')?.value).toBe('20270215T100000');
		expect(prop(eventOf(booked), 'DTSTAMP')?.value).toMatch(/Z$/);
		expect(prop(eventOf(cancelled), 'STATUS')?.value).toBe('CANCELLED');
		expect(Number(prop(eventOf(cancelled), 'SEQUENCE')?.value)).toBeGreaterThan(
			Number(prop(eventOf(booked), 'SEQUENCE')?.value)
		);
		const stranger = await createUser(db);
		expect((await refusal(calendarForParty(db, { fittingId: a.id, actor: as(stranger, 'customer') }))).code).toBe(
			'not_found'
		);
	});
});
