import { and, eq } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { createPortfolioPhoto, createUser, createWorkroom } from '../../../../tests/factories';
import { createDb } from '../db/client';
import { auditEvent, tailorProfile } from '../db/schema';
import * as payouts from '../payouts';
import * as workrooms from '.';

// The integration setup gives this file its own copy of the seeded demo database.
const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 3 });
afterAll(() => pool.end());

/** Every onboarding step filled in, as the setup pages would leave it (the photo is added by each test). */
const complete = {
	bio: 'Trousers and skirts cut to your own measurements, with two fittings as standard.',
	capacity: 3,
	leadTimes: { 'straight-skirt': 10, 'wide-leg-trousers': 18 },
	labourHours: { 'straight-skirt': 5, 'wide-leg-trousers': 8.5 }
};

const reopenedEvents = (tailorId: string) =>
	db
		.select({ id: auditEvent.id })
		.from(auditEvent)
		.where(and(eq(auditEvent.subjectId, tailorId), eq(auditEvent.action, 'workroom.onboarding_reopened')));

/** What the workroom home read before it was one statement: three reads, each on its own. */
async function separately(tailorId: string) {
	const [workroom, onboarding, payoutsReady] = await Promise.all([
		workrooms.getOwn(db, { tailorId }),
		workrooms.onboardingStatus(db, { tailorId }),
		payouts.ready(db, tailorId)
	]);
	return { workroom, onboarding, payoutsReady };
}

describe("the workroom home's one read", () => {
	it('answers as the separate reads do for an onboarded workroom with payouts set up', async () => {
		const tailor = await createWorkroom(db, { profile: complete });
		await createPortfolioPhoto(db, { tailorId: tailor.id, altText: 'A charcoal straight skirt on a stand' });
		const home = await workrooms.home(db, { tailorId: tailor.id });
		expect(home.onboarding).toEqual({ complete: true, missing: [] });
		expect(home.payoutsReady).toBe(true);
		expect(home.workroom?.slug).toBe(tailor.slug);
		expect(home.workroom?.onboardedAt).toBeInstanceOf(Date);
		expect(home).toEqual(await separately(tailor.id));
	});

	it('says payouts are not ready while the account is pending, as payouts.ready does', async () => {
		const tailor = await createWorkroom(db, { profile: { ...complete, payoutStatus: 'pending' } });
		await createPortfolioPhoto(db, { tailorId: tailor.id, altText: 'A wide-leg trouser hem, close up' });
		const home = await workrooms.home(db, { tailorId: tailor.id });
		expect(home.payoutsReady).toBe(false);
		expect(home).toEqual(await separately(tailor.id));
	});

	it('gives a tailor without a workroom every step to do and no payouts', async () => {
		const tailor = await createUser(db, { role: 'tailor' });
		const home = await workrooms.home(db, { tailorId: tailor.id });
		expect(home.workroom).toBeNull();
		expect(home.payoutsReady).toBe(false);
		expect(home.onboarding.complete).toBe(false);
		expect(home.onboarding.missing.map((m) => m.step)).toContain('portfolio');
		expect(home).toEqual(await separately(tailor.id));
	});

	it('brings onboarded_at back in step once when the last photo went, and only reads after that', async () => {
		// Marked onboarded, but no portfolio photo: as after the last photo was removed elsewhere.
		const tailor = await createWorkroom(db, { profile: complete });
		const home = await workrooms.home(db, { tailorId: tailor.id });
		expect(home.onboarding.complete).toBe(false);
		expect(home.onboarding.missing).toEqual([{ step: 'portfolio' }]);
		expect(home.workroom?.onboardedAt).toBeNull();
		const [row] = await db
			.select({ onboardedAt: tailorProfile.onboardedAt })
			.from(tailorProfile)
			.where(eq(tailorProfile.userId, tailor.id));
		expect(row.onboardedAt).toBeNull();
		expect(await reopenedEvents(tailor.id)).toHaveLength(1);

		// In step now: another look changes nothing and records nothing.
		expect(await workrooms.home(db, { tailorId: tailor.id })).toEqual(home);
		expect(await reopenedEvents(tailor.id)).toHaveLength(1);

		// A photo completes it again, and the next look sets onboarded_at.
		await createPortfolioPhoto(db, { tailorId: tailor.id, altText: 'A finished skirt on the rail' });
		const again = await workrooms.home(db, { tailorId: tailor.id });
		expect(again.onboarding.complete).toBe(true);
		expect(again.workroom?.onboardedAt).toBeInstanceOf(Date);
	});

	it('works inside a caller’s transaction as on the pool', async () => {
		const tailor = await createWorkroom(db, { profile: complete });
		await createPortfolioPhoto(db, { tailorId: tailor.id, altText: 'A lined jacket front' });
		const inside = await db.transaction((tx) => workrooms.home(tx, { tailorId: tailor.id }));
		expect(inside).toEqual(await workrooms.home(db, { tailorId: tailor.id }));
	});
});

describe("a near-me list's origin", () => {
	it("is the workroom's place, reach and rates' currency, as getOwn has them", async () => {
		const tailor = await createWorkroom(db, { profile: { serviceRadiusKm: 18 } });
		const own = (await workrooms.getOwn(db, { tailorId: tailor.id }))!;
		expect(await workrooms.listOrigin(db, { tailorId: tailor.id })).toEqual({
			location: { town: own.location.town, lat: own.location.lat, lng: own.location.lng },
			serviceRadiusKm: 18,
			currency: own.rates!.currency
		});
	});

	it('has no currency without a rate, and is null without a workroom', async () => {
		const unrated = await createWorkroom(db, { profile: { hourlyRateMinor: null, rateCurrency: 'GBP' } });
		expect((await workrooms.listOrigin(db, { tailorId: unrated.id }))?.currency).toBeNull();
		expect((await workrooms.getOwn(db, { tailorId: unrated.id }))?.rates).toBeNull();
		const newcomer = await createUser(db, { role: 'tailor' });
		expect(await workrooms.listOrigin(db, { tailorId: newcomer.id })).toBeNull();
	});
});
