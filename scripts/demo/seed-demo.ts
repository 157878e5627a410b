/** The demo scenario: tailors, customers and open commissions in Merrowgate, a city of our own invention. */
import { eq } from 'drizzle-orm';
import { hashPassword } from '../../src/lib/server/accounts/password';
import type { Database } from '../../src/lib/server/db/client';
import { addLocalPlaces } from '../../src/lib/server/places';
import {
	commission,
	commissionMeasurements,
	commissionSizeBand,
	measurementProfile,
	quote,
	tailorProfile,
	user
} from '../../src/lib/server/db/schema';
import { demoCommissionMeasurements, demoCommissions } from './commissions';
import { seedDemoPhotos, storageConfigured } from './images';
import { demoMeasurementProfiles } from './measurements';
import { seedDemoMessages } from './messages';
import { adminEmail, demoPassword, demoUsers } from './people';
import { demoPlaces } from './places';
import { demoQuotes } from './quotes';
import { demoTailorProfiles } from './tailors';

export type SeedResult = 'seeded' | 'already-seeded';

/** Idempotent: fixed ids and `on conflict do nothing`, and a quick exit once the demo admin exists. */
export async function seedDemo(db: Database): Promise<SeedResult> {
	const [marker] = await db.select({ id: user.id }).from(user).where(eq(user.email, adminEmail)).limit(1);
	if (marker) return 'already-seeded';

	// Hashed once for every demo login: argon2 is slow on purpose.
	const passwordHash = await hashPassword(demoPassword);
	const now = new Date();
	const profiles = demoMeasurementProfiles(now);

	await db.transaction(async (tx) => {
		await addLocalPlaces(tx, demoPlaces());
		await tx.insert(user).values(demoUsers(passwordHash, now)).onConflictDoNothing();
		await tx.insert(tailorProfile).values(demoTailorProfiles(now)).onConflictDoNothing();
		await tx.insert(measurementProfile).values(Object.values(profiles)).onConflictDoNothing();
		await tx.insert(commission).values(demoCommissions(now)).onConflictDoNothing();
		const posted = demoCommissionMeasurements(profiles);
		await tx
			.insert(commissionMeasurements)
			.values(posted.map((p) => p.snapshot))
			.onConflictDoNothing();
		await tx
			.insert(commissionSizeBand)
			.values(posted.flatMap((p) => p.band))
			.onConflictDoNothing();
		await tx.insert(quote).values(demoQuotes(now)).onConflictDoNothing();
		await seedDemoMessages(tx, now);
	});
	// Photos go through the photos area into the bucket; without one (a bare `npm run db:seed`) there are none.
	if (storageConfigured()) {
		await seedDemoPhotos(
			db,
			demoCommissions(now).map((c) => ({ id: c.id!, garmentType: c.garmentType, status: c.status ?? 'draft' })),
			demoTailorProfiles(now).map((t) => ({ userId: t.userId, specialties: t.specialties ?? [] }))
		);
	}
	return 'seeded';
}
