import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { createCommission, createCustomerWithProfile, createUser } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { commissionPhoto, user } from '../db/schema';
import { listForCustomer, listOpen, searchDocuments } from '.';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

describe('commission lists', () => {
	it("counts each commission's live quotes for its customer", async () => {
		const [customer] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'customer@tackline.test'));
		const mine = await listForCustomer(db, { customerId: customer.id });
		expect(mine.length).toBeGreaterThan(0);
		const trousers = mine.find((c) => c.title === 'High-waisted wide-leg trousers in washed linen');
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

describe("the customer's list judges drafts' dates in their own day", () => {
	const dayMs = 86_400_000;
	const utcDay = (offsetDays: number) => new Date(Date.now() + offsetDays * dayMs).toISOString().slice(0, 10);

	/** A customer's draft complete but for its date needed. */
	async function draftsNeeded(offsets: number[]) {
		const { person, profileId } = await createCustomerWithProfile(db);
		for (const offset of offsets)
			await createCommission(db, {
				customerId: person.id,
				status: 'draft',
				measurementProfileId: profileId,
				dateNeeded: utcDay(offset),
				title: `Needed on day ${offset}`
			});
		return person.id;
	}

	it('reads the time zone only for a draft needed within a day of today', async () => {
		// Every time zone's date is within a day of UTC's (UTC−12 to UTC+14): the zone cannot change these.
		const customerId = await draftsNeeded([30, -30]);
		let reads = 0;
		const list = await listForCustomer(db, {
			customerId,
			today: () => {
				reads += 1;
				return Promise.resolve(utcDay(0));
			}
		});
		expect(reads).toBe(0);
		const stepOf = (title: string) => list.find((c) => c.title === title)?.continueAt;
		expect(stepOf('Needed on day 30')).toBe('review');
		expect(stepOf('Needed on day -30')).toBe('budget');
	});

	it("judges a draft needed tomorrow by the customer's day, read once", async () => {
		const customerId = await draftsNeeded([1, 30]);
		let reads = 0;
		const listOn = (day: string) =>
			listForCustomer(db, {
				customerId,
				today: () => {
					reads += 1;
					return Promise.resolve(day);
				}
			});
		// Where it is already tomorrow, the date needed has come: back to the budget step.
		const east = await listOn(utcDay(1));
		expect(reads).toBe(1);
		expect(east.find((c) => c.title === 'Needed on day 1')?.continueAt).toBe('budget');
		// Where it is still today, the draft is ready to review.
		const west = await listOn(utcDay(0));
		expect(reads).toBe(2);
		expect(west.find((c) => c.title === 'Needed on day 1')?.continueAt).toBe('review');
		// The same answers as with the day given outright.
		expect(await listForCustomer(db, { customerId, today: utcDay(1) })).toEqual(east);
		expect(await listForCustomer(db, { customerId, today: utcDay(0) })).toEqual(west);
	});
});

describe('near-me cards', () => {
	it('carry their own size band and first photo, and only while open', async () => {
		const open = await createCommission(db, { status: 'open' });
		const other = await createCommission(db, { status: 'open' });
		const closed = await createCommission(db, { status: 'cancelled' });
		const photo = (commissionId: string, sortOrder: number, altText: string) => ({
			commissionId,
			sortOrder,
			altText,
			storageKey: `test/${commissionId}/${sortOrder}`,
			contentType: 'image/webp',
			bytes: 1000,
			width: 800,
			height: 600
		});
		const [first] = await db
			.insert(commissionPhoto)
			.values([photo(open.id, 2, 'Back view'), photo(open.id, 1, 'The front, pinned'), photo(other.id, 1, 'Elsewhere')])
			.returning({ id: commissionPhoto.id, altText: commissionPhoto.altText })
			.then((rows) => rows.filter((row) => row.altText === 'The front, pinned'));

		const cards = await searchDocuments.cardsByIds(db, [open.id, closed.id]);
		expect([...cards.keys()]).toEqual([open.id]);
		const card = cards.get(open.id)!;
		expect(card.photo).toEqual({ id: first.id, altText: 'The front, pinned' });
		expect(card.sizeBand.map((band) => band.dimension)).toEqual(['waist_girth', 'hip_girth']);
		expect(card.budget).toEqual({ minMinor: 6000, maxMinor: 9000, currency: 'EUR' });
		expect((await searchDocuments.cardsByIds(db, [other.id])).get(other.id)?.photo?.altText).toBe('Elsewhere');
		expect(await searchDocuments.cardsByIds(db, [])).toEqual(new Map());
	});

	it('count photos per commission in the open list', async () => {
		const open = await createCommission(db, { status: 'open', publishedAt: new Date(Date.now() + 120_000) });
		await db.insert(commissionPhoto).values({
			commissionId: open.id,
			storageKey: `test/${open.id}/count`,
			contentType: 'image/webp',
			bytes: 1000,
			width: 800,
			height: 600
		});
		const [newest] = await listOpen(db, { limit: 1 });
		expect(newest).toMatchObject({ id: open.id, photoCount: 1 });
	});
});
