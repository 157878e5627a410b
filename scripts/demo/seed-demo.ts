/** The demo scenario: tailors, customers and open commissions in Merrowgate, a city of our own invention. */
import { eq, sql, type AnyColumn } from 'drizzle-orm';
import { hashPassword } from '../../src/lib/server/accounts/password';
import type { Database } from '../../src/lib/server/db/client';
import { addLocalPlaces } from '../../src/lib/server/places';
import {
	commission,
	commissionMeasurements,
	commissionSizeBand,
	measurementProfile,
	tailorProfile,
	user
} from '../../src/lib/server/db/schema';
import { demoCommissionMeasurements, demoCommissions } from './commissions';
import { seedDemoPhotos, storageConfigured } from './images';
import { demoMeasurementProfiles } from './measurements';
import { seedDemoMessages } from './messages';
import { seedDemoOrders } from './orders';
import { adminEmail, demoPassword, demoUsers } from './people';
import { seedDemoPayouts } from './payouts';
import { demoPlaces } from './places';
import { seedDemoQuotes } from './quotes';
import { demoTailorProfiles } from './tailors';

export type SeedResult = 'seeded' | 'already-seeded';

/** Keeps what is there (someone may have edited it in the demo) and fills what an older seed left empty. */
const keepOrFill = (column: AnyColumn, excluded: string) => sql`coalesce(${column}, excluded.${sql.raw(excluded)})`;
const keepOrFillJson = (column: AnyColumn, excluded: string) =>
	sql`case when ${column} = '{}'::jsonb then excluded.${sql.raw(excluded)} else ${column} end`;

/**
 * Idempotent: fixed ids and `on conflict do nothing`, so a second run adds nothing and keeps whatever was done
 * in the demo since. Rows an older version of the seed wrote are brought up to date where they have gaps
 * (a workroom without rates or lead times, a commission without its country), so an existing `.data` shows
 * the same demo as a fresh one.
 */
export async function seedDemo(db: Database): Promise<SeedResult> {
	const [marker] = await db.select({ id: user.id }).from(user).where(eq(user.email, adminEmail)).limit(1);

	// Hashed once for every demo login: argon2 is slow on purpose.
	const passwordHash = marker ? '' : await hashPassword(demoPassword);
	const now = new Date();
	const profiles = demoMeasurementProfiles(now);

	await db.transaction(async (tx) => {
		await addLocalPlaces(tx, demoPlaces());
		if (!marker) await tx.insert(user).values(demoUsers(passwordHash, now)).onConflictDoNothing();
		await tx
			.insert(tailorProfile)
			.values(demoTailorProfiles(now))
			.onConflictDoUpdate({
				target: tailorProfile.userId,
				set: {
					countryCode: keepOrFill(tailorProfile.countryCode, 'country_code'),
					hourlyRateMinor: keepOrFill(tailorProfile.hourlyRateMinor, 'hourly_rate_minor'),
					rateCurrency: keepOrFill(tailorProfile.rateCurrency, 'rate_currency'),
					onboardedAt: keepOrFill(tailorProfile.onboardedAt, 'onboarded_at'),
					leadTimes: keepOrFillJson(tailorProfile.leadTimes, 'lead_times'),
					labourHours: keepOrFillJson(tailorProfile.labourHours, 'labour_hours')
				}
			});
		await tx.insert(measurementProfile).values(Object.values(profiles)).onConflictDoNothing();
		await tx
			.insert(commission)
			.values(demoCommissions(now))
			.onConflictDoUpdate({
				target: commission.id,
				set: {
					countryCode: keepOrFill(commission.countryCode, 'country_code'),
					expiresAt: keepOrFill(commission.expiresAt, 'expires_at')
				}
			});
		const posted = demoCommissionMeasurements(profiles);
		await tx
			.insert(commissionMeasurements)
			.values(posted.map((p) => p.snapshot))
			.onConflictDoNothing();
		await tx
			.insert(commissionSizeBand)
			.values(posted.flatMap((p) => p.band))
			.onConflictDoNothing();
		await seedDemoQuotes(tx, now);
		await seedDemoMessages(tx, now);
	});
	await seedDemoPayouts(
		db,
		demoTailorProfiles(now).map((t) => t.userId)
	);
	// Photos go through the photos area into the bucket; without one (a bare `npm run db:seed`) there are none.
	if (storageConfigured()) {
		await seedDemoPhotos(
			db,
			demoCommissions(now).map((c) => ({ id: c.id!, garmentType: c.garmentType, status: c.status ?? 'draft' })),
			demoTailorProfiles(now).map((t) => ({ userId: t.userId, specialties: t.specialties ?? [] }))
		);
	}
	// Last: the orders go through the product's own functions, which need the workrooms' payouts set up.
	await seedDemoOrders(db, now);
	return marker ? 'already-seeded' : 'seeded';
}
