import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db } from '../db';
import { user } from '../db/schema';
import { listForCustomer, listOpen } from '.';

// Runs against the seeded demo city in the test database.
describe('commission lists', () => {
	it("counts each commission's live quotes for its customer", async () => {
		const [customer] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'customer@tackline.test'));
		const mine = await listForCustomer({ customerId: customer.id });
		expect(mine.length).toBeGreaterThan(0);
		const trousers = mine.find((c) => c.garmentType === 'wide-leg-trousers');
		expect(trousers?.quoteCount).toBe(3);
		expect(mine.filter((c) => c.status === 'draft').every((c) => c.quoteCount === 0)).toBe(true);
	});

	it('lists only open commissions, newest first, without measurements', async () => {
		const open = await listOpen({ limit: 50 });
		expect(open.length).toBeGreaterThan(0);
		for (const row of open) expect(Object.keys(row)).not.toContain('measurementSnapshot');
		expect(open.map((c) => c.title)).not.toContain('Straight skirt for work');
	});
});
