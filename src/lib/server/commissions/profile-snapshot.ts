import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db';
import { measurementProfile } from '../db/schema';

/** The owner's profile as publishing freezes it; null when it is gone or someone else's. */
export async function snapshotFor(db: Executor, { profileId, ownerId }: { profileId: string; ownerId: string }) {
	const [row] = await db
		.select({
			profileId: measurementProfile.id,
			label: measurementProfile.label,
			unit: measurementProfile.unit,
			valuesMm: measurementProfile.valuesMm,
			takenBy: measurementProfile.takenBy,
			takenAt: measurementProfile.takenAt
		})
		.from(measurementProfile)
		.where(and(eq(measurementProfile.id, profileId), eq(measurementProfile.ownerId, ownerId)))
		.limit(1);
	return row ?? null;
}

/** The owner's profiles for the measurements step: labels and which codes each holds. */
export async function profilesOf(db: Executor, { ownerId }: { ownerId: string }) {
	const rows = await db
		.select({ id: measurementProfile.id, label: measurementProfile.label, valuesMm: measurementProfile.valuesMm })
		.from(measurementProfile)
		.where(eq(measurementProfile.ownerId, ownerId))
		.orderBy(measurementProfile.label);
	return rows.map(({ valuesMm, ...row }) => ({ ...row, codes: Object.keys(valuesMm) }));
}
