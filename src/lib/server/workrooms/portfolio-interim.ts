// Until the portfolio area is merged: the two reads onboarding and the public page need, with its signatures.
import { asc, count, eq, inArray } from 'drizzle-orm';
import type { Executor } from '../db';
import { portfolioItem, portfolioPhoto } from '../db/schema';

export type PhotoView = { id: string; url: string; thumbUrl: string; width: number; height: number; altText: string };
export type PortfolioItemView = { id: string; caption: string; garmentType: string | null; photos: PhotoView[] };

export async function photoCount(db: Executor, tailorId: string): Promise<number> {
	const [row] = await db
		.select({ photos: count() })
		.from(portfolioPhoto)
		.innerJoin(portfolioItem, eq(portfolioItem.id, portfolioPhoto.itemId))
		.where(eq(portfolioItem.tailorId, tailorId));
	return row?.photos ?? 0;
}

export async function listItems(db: Executor, input: { tailorId: string }): Promise<PortfolioItemView[]> {
	const items = await db
		.select({ id: portfolioItem.id, caption: portfolioItem.caption, garmentType: portfolioItem.garmentType })
		.from(portfolioItem)
		.where(eq(portfolioItem.tailorId, input.tailorId))
		.orderBy(asc(portfolioItem.sortOrder), asc(portfolioItem.createdAt));
	if (items.length === 0) return [];
	const photos = await db
		.select({
			id: portfolioPhoto.id,
			itemId: portfolioPhoto.itemId,
			width: portfolioPhoto.width,
			height: portfolioPhoto.height,
			altText: portfolioPhoto.altText
		})
		.from(portfolioPhoto)
		.where(
			inArray(
				portfolioPhoto.itemId,
				items.map((item) => item.id)
			)
		)
		.orderBy(asc(portfolioPhoto.sortOrder), asc(portfolioPhoto.createdAt));
	return items.map((item) => ({
		...item,
		photos: photos
			.filter((p) => p.itemId === item.id)
			.map(({ itemId: _, ...p }) => ({ ...p, url: `/photos/${p.id}/full`, thumbUrl: `/photos/${p.id}/thumb` }))
	}));
}

/** The first photo of each workroom's portfolio, for directory cards. */
export async function coverPhotoIds(db: Executor, tailorIds: string[]): Promise<Map<string, string>> {
	if (tailorIds.length === 0) return new Map();
	const rows = await db
		.selectDistinctOn([portfolioItem.tailorId], { tailorId: portfolioItem.tailorId, photoId: portfolioPhoto.id })
		.from(portfolioPhoto)
		.innerJoin(portfolioItem, eq(portfolioItem.id, portfolioPhoto.itemId))
		.where(inArray(portfolioItem.tailorId, tailorIds))
		.orderBy(
			portfolioItem.tailorId,
			asc(portfolioItem.sortOrder),
			asc(portfolioPhoto.sortOrder),
			asc(portfolioPhoto.createdAt)
		);
	return new Map(rows.map((row) => [row.tailorId, row.photoId]));
}
