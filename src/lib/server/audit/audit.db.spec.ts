import { eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { createUser } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { auditEvent } from '../db/schema';
import { record } from '.';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

const eventsAbout = (subjectId: string) =>
	db
		.select({ action: auditEvent.action, actorId: auditEvent.actorId, ip: auditEvent.ip, data: auditEvent.data })
		.from(auditEvent)
		.where(eq(auditEvent.subjectId, subjectId));

describe('audit record', () => {
	it('keeps the actor and the address its caller passes', async () => {
		const admin = await createUser(db, { role: 'admin' });
		const subject = await createUser(db);
		await record(db, {
			actorId: admin.id,
			ip: '198.18.4.7',
			action: 'account.suspended',
			subjectType: 'user',
			subjectId: subject.id,
			data: { reason: 'test' }
		});
		expect(await eventsAbout(subject.id)).toEqual([
			{ action: 'account.suspended', actorId: admin.id, ip: '198.18.4.7', data: { reason: 'test' } }
		]);
	});

	it('has no address outside a request, and rolls back with the change it belongs to', async () => {
		const subject = await createUser(db);
		await record(db, { actorId: null, action: 'account.reinstated', subjectType: 'user', subjectId: subject.id });
		expect((await eventsAbout(subject.id))[0].ip).toBeNull();

		await expect(
			db.transaction(async (tx) => {
				await record(tx, { actorId: null, action: 'account.suspended', subjectType: 'user', subjectId: subject.id });
				throw new Error('the change failed');
			})
		).rejects.toThrow('the change failed');
		expect((await eventsAbout(subject.id)).map((e) => e.action)).toEqual(['account.reinstated']);
	});
});
