import { eq, sql } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../scripts/demo/seed-demo';
import { checkMeasurements } from '../../src/lib/drafting';
import { commission, measurementProfile, quote, tailorProfile, user } from '../../src/lib/server/db/schema';
import { testDb } from './db';

const { db, pool } = testDb();
afterAll(() => pool.end());

const demoTables = { user, tailorProfile, measurementProfile, commission, quote };

async function demoCounts() {
	const entries = await Promise.all(
		Object.entries(demoTables).map(async ([name, table]) => {
			const [row] = await db
				.select({ n: sql<number>`count(*)::int` })
				.from(table)
				.where(name === 'user' ? sql`${user.email} like '%@tackline.test'` : undefined);
			return [name, row.n] as const;
		})
	);
	return Object.fromEntries(entries);
}

describe('demo seed', () => {
	it('is idempotent, and restores a missing row without touching the rest', async () => {
		const before = await demoCounts();
		expect(before.user).toBeGreaterThanOrEqual(15);
		expect(await seedDemo(db)).toBe('already-seeded');

		await db.delete(user).where(eq(user.email, 'admin@tackline.test'));
		expect(await seedDemo(db)).toBe('seeded');
		expect(await demoCounts()).toEqual(before);
	});

	it('fills the gaps an older seed left in a workroom and keeps what was edited since', async () => {
		const [demoTailor] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'tailor@tackline.test'));
		await db
			.update(tailorProfile)
			.set({ onboardedAt: null, rateCurrency: null, leadTimes: {}, labourHours: {}, hourlyRateMinor: 9900 })
			.where(eq(tailorProfile.userId, demoTailor.id));

		expect(await seedDemo(db)).toBe('already-seeded');

		const [after] = await db.select().from(tailorProfile).where(eq(tailorProfile.userId, demoTailor.id));
		expect(after.onboardedAt).not.toBeNull();
		expect(after.rateCurrency).toMatch(/^[A-Z]{3}$/);
		expect(Object.keys(after.leadTimes).length).toBeGreaterThan(0);
		expect(Object.keys(after.labourHours).length).toBeGreaterThan(0);
		expect(after.hourlyRateMinor).toBe(9900);
	});

	it('gives every demo measurement profile values the measurement checks accept', async () => {
		const profiles = await db
			.select({ label: measurementProfile.label, valuesMm: measurementProfile.valuesMm })
			.from(measurementProfile);
		expect(profiles.length).toBeGreaterThan(0);
		for (const profile of profiles) {
			const result = checkMeasurements(profile.valuesMm, 'cm');
			expect(result.errors, profile.label).toEqual([]);
		}
	});
});
