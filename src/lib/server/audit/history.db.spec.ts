import { randomUUID } from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../db/client';
import { auditEvent, user } from '../db/schema';
import { historiesFor, historyFor } from './history';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

async function newUser(name: string) {
	const [row] = await db
		.insert(user)
		.values({ name, email: `${name.toLowerCase()}.${randomUUID()}@example.test` })
		.returning({ id: user.id });
	return row.id;
}

const at = (minute: number) => new Date(Date.UTC(2027, 0, 10, 9, minute));

describe('audit history', () => {
	it('tells who did what to a person and why, newest first', async () => {
		const admin = await newUser('Warden');
		const member = await newUser('Member');
		await db.insert(auditEvent).values([
			{ actorId: member, action: 'account.registered', subjectType: 'user', subjectId: member, createdAt: at(0) },
			{
				actorId: admin,
				action: 'account.suspended',
				subjectType: 'user',
				subjectId: member,
				data: { reason: 'Asked for payment outside Tackline' },
				createdAt: at(5)
			},
			{ actorId: admin, action: 'account.reinstated', subjectType: 'user', subjectId: member, createdAt: at(9) },
			{ actorId: null, action: 'order.released', subjectType: 'order', subjectId: member, createdAt: at(7) }
		]);

		const history = await historyFor(db, { subjectType: 'user', subjectId: member });
		expect(history.map((entry) => entry.action)).toEqual([
			'account.reinstated',
			'account.suspended',
			'account.registered'
		]);
		expect(history[0]).toMatchObject({ at: at(9), actor: { id: admin, name: 'Warden' }, reason: null });
		expect(history[1]).toMatchObject({ actor: { id: admin }, reason: 'Asked for payment outside Tackline' });
		expect(history[2].actor?.id).toBe(member);
	});

	it('reads many people at once, keeping only the latest events of each', async () => {
		const first = await newUser('First');
		const second = await newUser('Second');
		const quiet = await newUser('Quiet');
		await db.insert(auditEvent).values(
			[1, 2, 3].flatMap((minute) => [
				{ actorId: null, action: `test.step_${minute}`, subjectType: 'user', subjectId: first, createdAt: at(minute) },
				{ actorId: null, action: `test.step_${minute}`, subjectType: 'user', subjectId: second, createdAt: at(minute) }
			])
		);

		const histories = await historiesFor(db, { subjectType: 'user', subjectIds: [first, second, quiet], limitEach: 2 });
		expect(histories.get(first)?.map((e) => e.action)).toEqual(['test.step_3', 'test.step_2']);
		expect(histories.get(second)?.map((e) => e.action)).toEqual(['test.step_3', 'test.step_2']);
		expect(histories.get(first)?.[0].actor).toBeNull();
		expect(histories.get(quiet)).toEqual([]);
		expect((await historiesFor(db, { subjectType: 'user', subjectIds: [] })).size).toBe(0);
	});
});
