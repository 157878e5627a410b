import { afterAll, describe, expect, it, vi } from 'vitest';
import { createCommission, createPortfolioPhoto, createUser, createWorkroom } from '../../../../tests/factories';
import { insertQuote } from '../../../../tests/factories/quotes';
import { createDb } from '../db/client';
import { compare } from './compare';

// The commissions area reads its settings (days open) through the environment.
vi.mock('$env/dynamic/private', () => ({ env: process.env }));

const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 2 });
afterAll(() => pool.end());

const hour = 3_600_000;
const day = 24 * hour;
const isoDay = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);

describe("the owner's comparison", async () => {
	const customer = await createUser(db);
	const tenHoursAgo = new Date(Date.now() - 10 * hour);
	const mine = await createCommission(db, {
		customerId: customer.id,
		dateNeeded: isoDay(60),
		budgetMinMinor: 6000,
		budgetMaxMinor: 9000,
		publishedAt: tenHoursAgo
	});
	// Next door, with a lead time and a portfolio photo; its first quote.
	const near = await createWorkroom(db, { profile: { leadTimes: { 'straight-skirt': 21 } } });
	await createPortfolioPhoto(db, { tailorId: near.id, altText: 'Navy skirt, side view' });
	// 0.18° of latitude north: about 20 km away; it has quoted three times before, 2, 4 and 6 hours after publication.
	const far = await createWorkroom(db, { profile: { lat: 46.8512 + 0.18 } });
	for (const hours of [2, 4, 6]) {
		const published = new Date(Date.now() - 30 * day);
		const other = await createCommission(db, { publishedAt: published });
		await insertQuote(db, {
			commissionId: other.id,
			tailorId: far.id,
			status: 'lapsed',
			createdAt: new Date(published.getTime() + hours * hour)
		});
	}
	const withdrawn = await createWorkroom(db);

	const nearQuote = await insertQuote(db, {
		commissionId: mine.id,
		tailorId: near.id,
		priceMinor: 8000,
		deliveryDate: isoDay(40)
	});
	const farQuote = await insertQuote(db, {
		commissionId: mine.id,
		tailorId: far.id,
		priceMinor: 9500,
		deliveryDate: isoDay(70)
	});
	const oldQuote = await insertQuote(db, { commissionId: mine.id, tailorId: withdrawn.id, status: 'withdrawn' });

	const comparison = (await compare(db, { commissionId: mine.id, ownerId: customer.id }))!;
	const byId = new Map(comparison.quotes.map((q) => [q.id, q]));

	it('puts the live quotes best first, then the closed ones', () => {
		expect(comparison.quotes.map((q) => q.id)).toEqual([nearQuote.id, farQuote.id, oldQuote.id]);
	});

	it('measures delivery against the date needed and the distance to each workroom', () => {
		expect(byId.get(nearQuote.id)).toMatchObject({
			daysBeforeNeeded: 20,
			leadTimeDays: 21,
			tailor: { name: near.shopName }
		});
		expect(byId.get(farQuote.id)).toMatchObject({ daysBeforeNeeded: -10, leadTimeDays: null });
		// Great-circle distances between the coarse points (factory places), to 0.1 km.
		expect(byId.get(nearQuote.id)!.distanceKm).toBeLessThan(0.5);
		expect(byId.get(farQuote.id)!.distanceKm).toBeGreaterThan(19.5);
		expect(byId.get(farQuote.id)!.distanceKm).toBeLessThan(20.5);
	});

	it('gives the median response time once a workroom has quoted three times, "new" before', () => {
		// Hours after publication: 2, 4, 6 and (this commission) 10 → median 5.
		expect(byId.get(farQuote.id)).toMatchObject({ responseSample: 4 });
		expect(byId.get(farQuote.id)!.responseHours).toBeCloseTo(5, 0);
		expect(byId.get(nearQuote.id)).toMatchObject({ responseHours: null, responseSample: 1 });
	});

	it('shows portfolio thumbnails through their checked addresses', () => {
		const [thumb] = byId.get(nearQuote.id)!.portfolio;
		expect(thumb).toMatchObject({ altText: 'Navy skirt, side view', width: 800, height: 600 });
		expect(thumb.thumbUrl).toBe(`/photos/${thumb.id}/thumb`);
		expect(byId.get(farQuote.id)!.portfolio).toEqual([]);
	});

	it('scores only the live quotes and explains the best fit', () => {
		expect(byId.get(nearQuote.id)!.fit).toMatchObject({ points: 9, max: 9 });
		// Late, over budget, second on price, 20 km away.
		expect(byId.get(farQuote.id)!.fit).toMatchObject({ points: 1, max: 9 });
		expect(byId.get(oldQuote.id)!.fit).toBeNull();
		expect(comparison.hint).toMatchObject({ quoteId: nearQuote.id, tiedWith: [] });
		expect(comparison.hint!.text).toContain(`${near.shopName} fits best`);
		expect(comparison.method.length).toBeGreaterThan(3);
	});

	it('is the owner’s alone', async () => {
		expect(await compare(db, { commissionId: mine.id, ownerId: (await createUser(db)).id })).toBeNull();
		expect(await compare(db, { commissionId: mine.id, ownerId: near.id })).toBeNull();
	});
});
