import { and, eq, sql } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { message, notification } from '../db/schema';
import { queueNames } from '../jobs';
import { listen } from '../services/notifications';
import * as notifications from '../notifications';
import * as messages from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 3 });
afterAll(() => pool.end());
beforeAll(async () => {
	process.env.ORIGIN ??= 'http://tackline.test';
	// No server runs for a db spec: make pg-boss's schema and the mail queue as the app's start would.
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

async function conversation(options: { status?: 'open' | 'awarded' | 'cancelled' } = {}) {
	const customer = await createUser(db, { name: 'Wenna Polglase' });
	const tailor = await createWorkroom(db, { profile: { shopName: 'Gull Yard Workroom' } });
	const commission = await createCommission(db, { customerId: customer.id, status: options.status ?? 'open' });
	const thread = await messages.openThread(db, { commissionId: commission.id, tailorId: tailor.id });
	return {
		customer: { id: customer.id, role: 'customer' as const, email: customer.email },
		tailor: { id: tailor.id, role: 'tailor' as const, email: tailor.email },
		commission,
		threadId: thread.id
	};
}

/** A message written straight into the table, `minutesAgo` old (time is driven by rows, never by sleeping). */
async function oldMessage(threadId: string, authorId: string, minutesAgo: number, body = 'Written a while ago') {
	const [row] = await db
		.insert(message)
		.values({ threadId, authorId, body, createdAt: new Date(Date.now() - minutesAgo * 60_000) })
		.returning({ id: message.id });
	return row.id;
}

async function mailJobsTo(address: string) {
	const result = await db.execute<{ data: { to: string; subject: string; text: string } }>(
		sql`select data from pgboss.job where name = ${queueNames.mail} and data->>'to' = ${address}`
	);
	return result.rows.map((row) => row.data);
}

describe('posting and reading', () => {
	it('lets both participants write and read, newest page first with keyset paging', async () => {
		const { customer, tailor, threadId } = await conversation();
		for (let i = 1; i <= 5; i += 1) {
			await messages.post(db, { threadId, actor: i % 2 ? tailor : customer, body: `  Message ${i}  ` });
		}
		const first = await messages.list(db, { threadId, viewer: customer, limit: 2 });
		expect(first.items.map((m) => m.body)).toEqual(['Message 5', 'Message 4']);
		expect(first.items[0].mine).toBe(false);
		expect(first.items[1].mine).toBe(true);
		const second = await messages.list(db, { threadId, viewer: tailor, limit: 2, cursor: first.nextCursor! });
		expect(second.items.map((m) => m.body)).toEqual(['Message 3', 'Message 2']);
		const last = await messages.list(db, { threadId, viewer: tailor, limit: 2, cursor: second.nextCursor! });
		expect(last.items.map((m) => m.body)).toEqual(['Message 1']);
		expect(last.nextCursor).toBeNull();
	});

	it('counts unread messages per person and clears them on markRead', async () => {
		const { customer, tailor, threadId } = await conversation();
		await messages.post(db, { threadId, actor: tailor, body: 'Is the hem to be let down later?' });
		await messages.post(db, { threadId, actor: tailor, body: 'And which lining do you prefer?' });
		await messages.post(db, { threadId, actor: customer, body: 'Yes, please leave 4 cm.' });
		expect(await messages.unreadCount(db, customer)).toBe(2);
		expect(await messages.unreadCount(db, tailor)).toBe(1);

		const inbox = await messages.threadsFor(db, { viewer: customer });
		expect(inbox.items).toHaveLength(1);
		expect(inbox.items[0]).toMatchObject({
			id: threadId,
			unreadCount: 2,
			otherParty: { name: 'Gull Yard Workroom', role: 'tailor' },
			lastMessage: { preview: 'Yes, please leave 4 cm.', mine: true }
		});
		const tailorInbox = await messages.threadsFor(db, { viewer: tailor });
		expect(tailorInbox.items[0].otherParty).toMatchObject({ name: 'Wenna P.', role: 'customer' });

		expect(await messages.markRead(db, { threadId, viewer: customer })).toBe(2);
		expect(await messages.unreadCount(db, customer)).toBe(0);
		expect(await messages.unreadCount(db, tailor)).toBe(1);
	});

	it("gives the header's two counts in one read, as the two counts do apart", async () => {
		const { customer, tailor, threadId } = await conversation();
		await messages.post(db, { threadId, actor: tailor, body: 'Shall I line the skirt?' });
		await messages.post(db, { threadId, actor: tailor, body: 'Silk or viscose?' });
		const apart = async (person: { id: string }) => ({
			messages: await messages.unreadCount(db, person),
			notices: await notifications.unreadCount(db, { userId: person.id })
		});
		expect((await messages.unreadCounts(db, customer)).messages).toBe(2);
		expect(await messages.unreadCounts(db, customer)).toEqual(await apart(customer));
		expect(await messages.unreadCounts(db, tailor)).toEqual({
			messages: 0,
			notices: await apart(tailor).then((a) => a.notices)
		});

		// Notices count up to the bell's cap, read ones not at all.
		const notice = {
			userId: customer.id,
			event: 'message_waiting' as const,
			title: 'A notice',
			body: '',
			href: '/messages'
		};
		await db
			.insert(notification)
			.values([
				...Array.from({ length: notifications.unreadCap + 5 }, () => notice),
				{ ...notice, readAt: new Date() }
			]);
		expect(await messages.unreadCounts(db, customer)).toEqual({ messages: 2, notices: notifications.unreadCap });
		expect(await messages.unreadCounts(db, customer)).toEqual(await apart(customer));
	});

	it('lists unread conversations first, then by latest message, paged by thread', async () => {
		const tailor = await createWorkroom(db);
		const actor = { id: tailor.id, role: 'tailor' as const };
		const threads: string[] = [];
		for (let i = 0; i < 3; i += 1) {
			const commission = await createCommission(db);
			const { id } = await messages.openThread(db, { commissionId: commission.id, tailorId: tailor.id });
			await messages.post(db, { threadId: id, actor, body: `Question ${i}` });
			threads.push(id);
		}
		// The customer of the first thread answers: that thread is now unread for the tailor.
		const facts = await db.execute<{ customer_id: string }>(
			sql`select c.customer_id from message_thread t join commission c on c.id = t.commission_id where t.id = ${threads[0]}`
		);
		await messages.post(db, {
			threadId: threads[0],
			actor: { id: facts.rows[0].customer_id, role: 'customer' },
			body: 'Answer'
		});
		const page1 = await messages.threadsFor(db, { viewer: actor, limit: 2 });
		expect(page1.items.map((t) => t.id)).toEqual([threads[0], threads[2]]);
		const page2 = await messages.threadsFor(db, { viewer: actor, limit: 2, cursor: page1.nextCursor! });
		expect(page2.items.map((t) => t.id)).toEqual([threads[1]]);
		expect(page2.nextCursor).toBeNull();
	});

	it('tells anyone else the thread does not exist, and refuses empty or overlong messages', async () => {
		const { customer, threadId } = await conversation();
		const stranger = await createUser(db);
		const otherTailor = await createWorkroom(db);
		for (const actor of [
			{ id: stranger.id, role: 'customer' as const },
			{ id: otherTailor.id, role: 'tailor' as const }
		]) {
			await expect(messages.post(db, { threadId, actor, body: 'Hello' })).rejects.toMatchObject({ code: 'not_found' });
			await expect(messages.list(db, { threadId, viewer: actor })).rejects.toMatchObject({ code: 'not_found' });
		}
		await expect(messages.post(db, { threadId, actor: customer, body: '   ' })).rejects.toMatchObject({
			code: 'invalid'
		});
		await expect(messages.post(db, { threadId, actor: customer, body: 'x'.repeat(4001) })).rejects.toMatchObject({
			code: 'invalid'
		});
		await expect(messages.post(db, { threadId, actor: customer, body: 'nul \u0000 here' })).rejects.toMatchObject({
			code: 'invalid'
		});
		expect((await messages.post(db, { threadId, actor: customer, body: 'x'.repeat(4000) })).body).toHaveLength(4000);
	});

	it('refuses a suspended participant and closes threads of cancelled commissions', async () => {
		const { customer, tailor, threadId } = await conversation();
		await db.execute(sql`update "user" set suspended_at = now() where id = ${tailor.id}`);
		await expect(messages.post(db, { threadId, actor: tailor, body: 'Hello' })).rejects.toMatchObject({
			code: 'forbidden'
		});
		const cancelled = await conversation({ status: 'cancelled' });
		await expect(
			messages.post(db, { threadId: cancelled.threadId, actor: cancelled.customer, body: 'Still there?' })
		).rejects.toMatchObject({ code: 'closed' });
		expect((await messages.getThread(db, { threadId: cancelled.threadId, viewer: cancelled.customer })).open).toBe(
			false
		);
		expect(customer.id).not.toBe(tailor.id);
	});

	it('lets an onboarded tailor ask about an open commission, once per thread', async () => {
		const customer = await createUser(db);
		const commission = await createCommission(db, { customerId: customer.id });
		const tailor = await createWorkroom(db);
		const actor = { id: tailor.id, role: 'tailor' as const };
		const first = await messages.startQuestion(db, { commissionId: commission.id, actor, body: 'Lined or unlined?' });
		const second = await messages.startQuestion(db, { commissionId: commission.id, actor, body: 'And the zip?' });
		expect(second.threadId).toBe(first.threadId);
		expect(await messages.unreadCount(db, { id: customer.id })).toBe(2);

		const starting = await createWorkroom(db, { onboarded: false });
		await expect(
			messages.startQuestion(db, {
				commissionId: commission.id,
				actor: { id: starting.id, role: 'tailor' },
				body: 'Hello?'
			})
		).rejects.toMatchObject({ code: 'not_onboarded' });
		const draft = await createCommission(db, { status: 'draft' });
		await expect(messages.startQuestion(db, { commissionId: draft.id, actor, body: 'Hello?' })).rejects.toMatchObject({
			code: 'not_found'
		});
		await expect(
			messages.startQuestion(db, {
				commissionId: commission.id,
				actor: { id: customer.id, role: 'customer' },
				body: 'x'
			})
		).rejects.toMatchObject({ code: 'forbidden' });
	});
});

describe('live notifications', () => {
	it('announces each committed message on the shared channel, and nothing for a rolled-back one', async () => {
		const { customer, threadId } = await conversation();
		const heard: string[] = [];
		const stop = await listen(messages.messagesChannel, (event) => {
			if (event.type === 'notification') heard.push(event.payload);
		});
		try {
			const posted = await messages.post(db, { threadId, actor: customer, body: 'Can you hear me?' });
			await expect.poll(() => heard.length, { timeout: 5000 }).toBe(1);
			expect(JSON.parse(heard[0])).toEqual({
				threadId,
				messageId: posted.id,
				people: [customer.id, expect.any(String)]
			});
		} finally {
			stop();
		}
	});
});

describe('the unread-message digest', () => {
	it('waits 15 minutes, then mails each recipient once with threads and counts but no message text', async () => {
		const { customer, tailor, threadId } = await conversation();
		await oldMessage(threadId, tailor.id, 20, 'A secret about the lining');
		await oldMessage(threadId, tailor.id, 18, 'Another private note');
		await oldMessage(threadId, customer.id, 10, 'Too recent to mail about');

		const sent = await db.transaction((tx) => messages.dueDigests(tx));
		const mine = sent.digests.filter((d) => [customer.id, tailor.id].includes(d.recipientId));
		expect(mine).toHaveLength(1);
		expect(mine[0]).toMatchObject({ recipientId: customer.id, threads: [{ threadId, count: 2 }] });

		await messages.sendDigests(db);
		const mails = await mailJobsTo(customer.email);
		expect(mails).toHaveLength(1);
		expect(mails[0].subject).toBe('2 messages are waiting for you on Tackline');
		expect(mails[0].text).toContain('Gull Yard Workroom');
		expect(mails[0].text).toContain(`/messages/${threadId}`);
		expect(mails[0].text).not.toContain('secret');
		expect(await mailJobsTo(tailor.email)).toHaveLength(0);

		// A second run finds nothing new; the recent message becomes due five minutes later, once.
		await messages.sendDigests(db);
		expect(await mailJobsTo(customer.email)).toHaveLength(1);
		await messages.sendDigests(db, { now: new Date(Date.now() + 6 * 60_000) });
		await messages.sendDigests(db, { now: new Date(Date.now() + 7 * 60_000) });
		expect(await mailJobsTo(tailor.email)).toHaveLength(1);
	});

	it('mails nobody about messages read in the meantime, nor a suspended recipient', async () => {
		const { customer, tailor, threadId } = await conversation();
		const id = await oldMessage(threadId, tailor.id, 30);
		await messages.markRead(db, { threadId, viewer: customer });
		await oldMessage(threadId, customer.id, 30);
		await db.execute(sql`update "user" set suspended_at = now() where id = ${tailor.id}`);
		await messages.sendDigests(db);
		expect(await mailJobsTo(customer.email)).toHaveLength(0);
		expect(await mailJobsTo(tailor.email)).toHaveLength(0);
		const [row] = await db
			.select({ notifiedAt: message.notifiedAt })
			.from(message)
			.where(and(eq(message.id, id)));
		expect(row.notifiedAt).toBeNull();
	});

	it('finds due messages through the partial index, not by scanning every message', async () => {
		await db.execute(sql`analyze message`);
		const plan = await db.transaction(async (tx) => {
			await tx.execute(sql`set local enable_seqscan = off`);
			return tx.execute<{ 'QUERY PLAN': string }>(sql`explain select id from message
				where read_at is null and notified_at is null and created_at <= now() - interval '15 minutes'`);
		});
		expect(plan.rows.map((r) => r['QUERY PLAN']).join('\n')).toContain('message_unread_unnotified_idx');
	});
});

describe('the listening connection', () => {
	it('reconnects after losing its connection, tells subscribers to re-read, and hears new messages again', async () => {
		const { customer, threadId } = await conversation();
		const events: string[] = [];
		const stop = await listen(messages.messagesChannel, (event) => {
			events.push(event.type === 'notification' ? `message:${JSON.parse(event.payload).messageId}` : event.type);
		});
		try {
			// The server ends the listening backend, as a restart or a failover would.
			await db.execute(
				sql`select pg_terminate_backend(pid) from pg_stat_activity where application_name = 'tackline-notifications'`
			);
			await expect.poll(() => events.includes('resync'), { timeout: 15_000 }).toBe(true);
			const posted = await messages.post(db, { threadId, actor: customer, body: 'After the reconnect' });
			await expect.poll(() => events.includes(`message:${posted.id}`), { timeout: 5000 }).toBe(true);
		} finally {
			stop();
		}
	});
});
