import { inArray } from 'drizzle-orm';
import type { WorkroomLabel } from '$lib/types/order-page';
import type { Executor } from '../db';
import { tailorProfile } from '../db/schema';

/**
 * Workrooms' names and where they are (town and district, never coordinates), by tailor id: what an order
 * page and order lists show of the workroom, whether or not it is taking work now.
 */
export async function labelsOf(db: Executor, tailorIds: string[]): Promise<Map<string, WorkroomLabel>> {
	if (tailorIds.length === 0) return new Map();
	const rows = await db
		.select({
			id: tailorProfile.userId,
			name: tailorProfile.shopName,
			slug: tailorProfile.slug,
			town: tailorProfile.city,
			district: tailorProfile.district
		})
		.from(tailorProfile)
		.where(inArray(tailorProfile.userId, [...new Set(tailorIds)]));
	return new Map(rows.map(({ id, ...label }) => [id, label]));
}
