import PgBoss from 'pg-boss';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createUser, createWorkroom } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { queueNames } from '../jobs';
import * as messages from '.';

// Kit's env module is fixed when vitest starts; this file's database is chosen by the setup after that.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 3 });
afterAll(() => pool.end());
beforeAll(async () => {
	process.env.ORIGIN ??= 'http://tackline.test';
	const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, supervise: false, schedule: false });
	await boss.start();
	await boss.createQueue(queueNames.mail);
	await boss.stop({ graceful: false, wait: true });
});

async function conversation() {
	const customer = await createUser(db, { name: 'Morwenna Tregear' });
	const tailor = await createWorkroom(db, { profile: { shopName: 'Slipway Workroom' } });
	const commission = await createCommission(db, { customerId: customer.id, status: 'open' });
	const thread = await messages.openThread(db, { commissionId: commission.id, tailorId: tailor.id });
	return {
		customer: { id: customer.id, role: 'customer' as const },
		tailor: { id: tailor.id, role: 'tailor' as const },
		threadId: thread.id
	};
}

/** Reads a server-sent-event stream in the background; `events` holds each event's name and data so far. */
function collect(stream: ReadableStream<Uint8Array>) {
	const events: { event: string; data: unknown }[] = [];
	const reader = stream.getReader();
	const decoder = new TextDecoder();
	let buffer = '';
	void (async () => {
		for (;;) {
			const { value, done } = await reader.read().catch(() => ({ value: undefined, done: true }));
			if (done) return;
			buffer += decoder.decode(value, { stream: true });
			let end: number;
			while ((end = buffer.indexOf('\n\n')) >= 0) {
				const block = buffer.slice(0, end);
				buffer = buffer.slice(end + 2);
				const event = /^event: (.*)$/m.exec(block)?.[1];
				const data = /^data: (.*)$/m.exec(block)?.[1];
				if (event && data) events.push({ event, data: JSON.parse(data) });
			}
		}
	})();
	return events;
}

describe("a person's unread stream", () => {
	it('starts with the count, then follows messages posted and read in their conversations only', async () => {
		const { customer, tailor, threadId } = await conversation();
		const other = await conversation();
		const controller = new AbortController();
		const events = collect(await messages.openUnreadStream(db, { viewer: customer, signal: controller.signal }));
		const counts = () => events.filter((e) => e.event === 'unread').map((e) => (e.data as { count: number }).count);
		try {
			await expect.poll(counts, { timeout: 5000 }).toEqual([0]);
			await messages.post(db, { threadId, actor: tailor, body: 'The toile is ready.' });
			await expect.poll(counts, { timeout: 5000 }).toEqual([0, 1]);
			await messages.post(db, { threadId, actor: tailor, body: 'Thursday suits?' });
			await expect.poll(counts, { timeout: 5000 }).toEqual([0, 1, 2]);
			// Someone else's conversation changes nothing here; the customer's own message neither.
			await messages.post(db, { threadId: other.threadId, actor: other.tailor, body: 'Not for you.' });
			await messages.post(db, { threadId, actor: customer, body: 'Thursday is fine.' });
			await messages.markRead(db, { threadId, viewer: customer });
			await expect.poll(counts, { timeout: 5000 }).toEqual([0, 1, 2, 0]);
		} finally {
			controller.abort();
		}
	});
});

describe("a thread's live stream", () => {
	it('tells the sender when the other side has read, and not the reader about their own reading', async () => {
		const { customer, tailor, threadId } = await conversation();
		const sender = new AbortController();
		const reader = new AbortController();
		const toTailor = collect(await messages.openStream(db, { threadId, viewer: tailor, signal: sender.signal }));
		const toCustomer = collect(await messages.openStream(db, { threadId, viewer: customer, signal: reader.signal }));
		try {
			const sent = await messages.post(db, { threadId, actor: tailor, body: 'Fabric arrived.' });
			await expect.poll(() => toCustomer.filter((e) => e.event === 'message').length, { timeout: 5000 }).toBe(1);
			expect(await messages.markRead(db, { threadId, viewer: customer })).toBe(1);
			await expect.poll(() => toTailor.filter((e) => e.event === 'read').length, { timeout: 5000 }).toBe(1);
			const { readAt } = toTailor.find((e) => e.event === 'read')!.data as { readAt: string };
			expect(readAt >= sent.createdAt).toBe(true);
			// Nothing left to mark: no second event.
			expect(await messages.markRead(db, { threadId, viewer: customer })).toBe(0);
			await new Promise((resolve) => setTimeout(resolve, 300));
			expect(toTailor.filter((e) => e.event === 'read')).toHaveLength(1);
			expect(toCustomer.filter((e) => e.event === 'read')).toHaveLength(0);
		} finally {
			sender.abort();
			reader.abort();
		}
	});
});
