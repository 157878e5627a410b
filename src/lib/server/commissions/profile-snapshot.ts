import type { Executor } from '../db';
import * as profiles from '../profiles';

/** The owner's profile as publishing freezes it; null when it is gone or someone else's. */
export function snapshotFor(db: Executor, { profileId, ownerId }: { profileId: string; ownerId: string }) {
	return profiles.snapshotFor(db, { ownerId, id: profileId });
}

/** The owner's profiles for the measurements step: labels and which codes each holds. */
export async function profilesOf(db: Executor, { ownerId }: { ownerId: string }) {
	const rows = await profiles.list(db, { ownerId });
	return rows
		.map(({ id, label, valuesMm }) => ({ id, label, codes: Object.keys(valuesMm) }))
		.sort((a, b) => a.label.localeCompare(b.label));
}
