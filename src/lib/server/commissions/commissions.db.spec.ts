import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { createCommission, createUser } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { user } from '../db/schema';
import { listForCustomer, listOpen } from '.';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

describe('commission lists', () => {
	it("counts each commission's live quotes for its customer", async () => {
		const [customer] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'customer@tackline.test'));
		const mine = await listForCustomer(db, { customerId: customer.id });
		expect(mine.length).toBeGreaterThan(0);
		const trousers = mine.find((c) => c.garmentType === 'wide-leg-trousers');
		expect(trousers?.quoteCount).toBe(3);
		expect(mine.filter((c) => c.status === 'draft').every((c) => c.quoteCount === 0)).toBe(true);
	});

	it("shows a customer their own commissions in every status and nobody else's", async () => {
		const customer = await createUser(db);
		const draft = await createCommission(db, { customerId: customer.id, status: 'draft' });
		const open = await createCommission(db, { customerId: customer.id, status: 'open' });
		const someoneElses = await createCommission(db, { status: 'open' });
		const ids = (await listForCustomer(db, { customerId: customer.id })).map((c) => c.id);
		expect(ids.sort()).toEqual([draft.id, open.id].sort());
		expect(ids).not.toContain(someoneElses.id);
	});

	it('lists only open commissions, newest first, without measurements', async () => {
		const draft = await createCommission(db, { status: 'draft' });
		const awarded = await createCommission(db, { status: 'awarded' });
		const newest = await createCommission(db, { status: 'open', publishedAt: new Date(Date.now() + 60_000) });
		const open = await listOpen(db, { limit: 50 });
		expect(open[0].id).toBe(newest.id);
		for (const row of open) expect(Object.keys(row)).not.toContain('measurementSnapshot');
		expect(open.map((c) => c.id)).not.toContain(draft.id);
		expect(open.map((c) => c.id)).not.toContain(awarded.id);
		expect(open.map((c) => c.title)).not.toContain('Straight skirt for work');
	});
});
