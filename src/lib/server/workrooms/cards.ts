import { and, eq, isNotNull, isNull } from 'drizzle-orm';
import type { GarmentId } from '$lib/drafting';
import type { Executor } from '../db';
import { tailorProfile, user } from '../db/schema';
import { portfolio } from '../photos';

/** Workrooms anyone may see: onboarded, and their tailor not suspended. Queries join `user` on the tailor. */
export const listed = and(isNotNull(tailorProfile.onboardedAt), isNull(user.suspendedAt), eq(user.role, 'tailor'));

/** Listed and taking work: the workrooms a customer may find near them. */
export const findable = and(listed, eq(tailorProfile.acceptingWork, true));

/** What every workroom card reads, whichever list it is in. */
export const cardColumns = {
	id: tailorProfile.userId,
	slug: tailorProfile.slug,
	name: tailorProfile.shopName,
	town: tailorProfile.city,
	district: tailorProfile.district,
	specialties: tailorProfile.specialties,
	ratingCount: tailorProfile.ratingCount,
	ratingAverageHundredths: tailorProfile.ratingAverageHundredths
};

/** The review summary shown for a workroom: no average until there is a review. */
export function reviewsOf(row: { ratingCount: number; ratingAverageHundredths: number }) {
	return { count: row.ratingCount, averageHundredths: row.ratingCount > 0 ? row.ratingAverageHundredths : null };
}

type CardRow = { id: string; specialties: string[]; ratingCount: number; ratingAverageHundredths: number };

/** Rows read with `cardColumns` (and any more) as cards: typed specialties, the cover photo and the reviews. */
export async function toCards<R extends CardRow>(db: Executor, rows: R[]) {
	const covers = await portfolio.coverPhotoIds(
		db,
		rows.map((row) => row.id)
	);
	return rows.map(({ ratingCount, ratingAverageHundredths, specialties, ...row }) => ({
		...row,
		specialties: specialties as GarmentId[],
		coverPhotoId: covers.get(row.id) ?? null,
		reviews: reviewsOf({ ratingCount, ratingAverageHundredths })
	}));
}
