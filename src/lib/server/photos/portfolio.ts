import { and, asc, count, eq, inArray, max, sql, type SQL } from 'drizzle-orm';
import { photoLimits, type PhotoView, type PortfolioItemView } from '$lib/types/photos';
import * as audit from '../audit';
import type { Executor } from '../db';
import { portfolioItem, portfolioPhoto } from '../db/schema';
import type { Person } from './commission-photos';
import { PhotoRuleBroken, notFound } from './errors';
import { checkOrder, forgetObjects, moved, photoRow, storeUpload, toView, type Upload } from './stored';

const photoColumns = {
	id: portfolioPhoto.id,
	itemId: portfolioPhoto.itemId,
	width: portfolioPhoto.width,
	height: portfolioPhoto.height,
	altText: portfolioPhoto.altText
};

/** How many portfolio photos a workroom holds (onboarding asks for at least one). */
export async function photoCount(db: Executor, tailorId: string): Promise<number> {
	const [row] = await db
		.select({ photos: count() })
		.from(portfolioPhoto)
		.innerJoin(portfolioItem, eq(portfolioItem.id, portfolioPhoto.itemId))
		.where(eq(portfolioItem.tailorId, tailorId));
	return row?.photos ?? 0;
}

/**
 * Whether the workroom holds a portfolio photo (all onboarding asks), as an expression for a caller that
 * reads it in the same statement as the workroom row.
 */
export function hasPhotoExpression(tailorId: unknown): SQL<boolean> {
	return sql<boolean>`exists (
		select 1 from ${portfolioPhoto} p join ${portfolioItem} i on i.id = p.item_id where i.tailor_id = ${tailorId}
	)`;
}

/** A workroom's portfolio, items and photos in their order. */
export async function listItems(db: Executor, input: { tailorId: string }): Promise<PortfolioItemView[]> {
	const items = await db
		.select({ id: portfolioItem.id, caption: portfolioItem.caption, garmentType: portfolioItem.garmentType })
		.from(portfolioItem)
		.where(eq(portfolioItem.tailorId, input.tailorId))
		.orderBy(asc(portfolioItem.sortOrder), asc(portfolioItem.createdAt));
	if (items.length === 0) return [];
	const photos = await db
		.select(photoColumns)
		.from(portfolioPhoto)
		.where(
			inArray(
				portfolioPhoto.itemId,
				items.map((item) => item.id)
			)
		)
		.orderBy(asc(portfolioPhoto.sortOrder), asc(portfolioPhoto.createdAt));
	return items.map((item) => ({ ...item, photos: photos.filter((p) => p.itemId === item.id).map(toView) }));
}

async function ownItem(db: Executor, actor: Person, itemId: string) {
	const [item] = await db
		.select({ id: portfolioItem.id })
		.from(portfolioItem)
		.where(and(eq(portfolioItem.id, itemId), eq(portfolioItem.tailorId, actor.id)));
	if (!item) throw notFound();
	return item;
}

async function itemView(db: Executor, actor: Person, itemId: string) {
	const item = (await listItems(db, { tailorId: actor.id })).find((i) => i.id === itemId);
	if (!item) throw notFound();
	return item;
}

/** Serialises portfolio changes of one workroom, so the photo limit holds under concurrent uploads. */
async function lockPortfolio(tx: Executor, tailorId: string) {
	await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${'portfolio:' + tailorId}))`);
}

function isMissingWorkroom(error: unknown) {
	const cause = (error as { cause?: { code?: string } }).cause ?? error;
	return (cause as { code?: string }).code === '23503';
}

/** A new, empty portfolio item at the end of the workroom's portfolio. */
export async function createItem(
	db: Executor,
	input: { actor: Person; caption: string; garmentType: string | null }
): Promise<PortfolioItemView> {
	const { actor } = input;
	try {
		return await db.transaction(async (tx) => {
			await lockPortfolio(tx, actor.id);
			const [last] = await tx
				.select({ sortOrder: max(portfolioItem.sortOrder) })
				.from(portfolioItem)
				.where(eq(portfolioItem.tailorId, actor.id));
			const [row] = await tx
				.insert(portfolioItem)
				.values({
					tailorId: actor.id,
					caption: input.caption,
					garmentType: input.garmentType,
					sortOrder: (last?.sortOrder ?? -1) + 1
				})
				.returning({ id: portfolioItem.id, caption: portfolioItem.caption, garmentType: portfolioItem.garmentType });
			await audit.record(tx, {
				actorId: actor.id,
				action: 'portfolio.item_added',
				subjectType: 'portfolio_item',
				subjectId: row.id
			});
			return { ...row, photos: [] };
		});
	} catch (error) {
		if (isMissingWorkroom(error)) {
			throw new PhotoRuleBroken('no_workroom', 'Name your workroom first; the portfolio belongs to it.');
		}
		throw error;
	}
}

/** Changes an item's caption and garment. */
export async function updateItem(
	db: Executor,
	input: { actor: Person; itemId: string; caption: string; garmentType: string | null }
): Promise<PortfolioItemView> {
	const { actor, itemId } = input;
	const [row] = await db
		.update(portfolioItem)
		.set({ caption: input.caption, garmentType: input.garmentType })
		.where(and(eq(portfolioItem.id, itemId), eq(portfolioItem.tailorId, actor.id)))
		.returning({ id: portfolioItem.id });
	if (!row) throw notFound();
	return itemView(db, actor, itemId);
}

/** Removes an item with its photos and their stored images. Call it outside a transaction. */
export async function removeItem(db: Executor, input: { actor: Person; itemId: string }) {
	const { actor, itemId } = input;
	const removed = await db.transaction(async (tx) => {
		await ownItem(tx, actor, itemId);
		const photos = await tx
			.delete(portfolioPhoto)
			.where(eq(portfolioPhoto.itemId, itemId))
			.returning({ storageKey: portfolioPhoto.storageKey, thumbKey: portfolioPhoto.thumbKey });
		await tx.delete(portfolioItem).where(eq(portfolioItem.id, itemId));
		await audit.record(tx, {
			actorId: actor.id,
			action: 'portfolio.item_removed',
			subjectType: 'portfolio_item',
			subjectId: itemId
		});
		return photos;
	});
	await forgetObjects(removed);
}

/** Puts the workroom's items in the order of `ids`, which must list each of them once. */
export async function reorderItems(
	db: Executor,
	input: { actor: Person; ids: string[] }
): Promise<PortfolioItemView[]> {
	const { actor, ids } = input;
	await db.transaction(async (tx) => {
		await lockPortfolio(tx, actor.id);
		const current = await tx
			.select({ id: portfolioItem.id })
			.from(portfolioItem)
			.where(eq(portfolioItem.tailorId, actor.id));
		checkOrder(
			current.map((item) => item.id),
			ids
		);
		for (const [index, id] of ids.entries()) {
			await tx.update(portfolioItem).set({ sortOrder: index }).where(eq(portfolioItem.id, id));
		}
	});
	return listItems(db, { tailorId: actor.id });
}

function limitReached() {
	return new PhotoRuleBroken(
		'photo_limit',
		`A portfolio holds at most ${photoLimits.portfolio} photos. Remove one before adding another.`
	);
}

/** Adds a photo to one of the actor's items (at most twelve across the portfolio). */
export async function addPhoto(
	db: Executor,
	input: { actor: Person; itemId: string; file: Upload; altText?: string }
): Promise<PhotoView> {
	const { actor, itemId } = input;
	await ownItem(db, actor, itemId);
	if ((await photoCount(db, actor.id)) >= photoLimits.portfolio) throw limitReached();
	return storeUpload(input.file, (stored) =>
		db.transaction(async (tx) => {
			await lockPortfolio(tx, actor.id);
			await ownItem(tx, actor, itemId);
			if ((await photoCount(tx, actor.id)) >= photoLimits.portfolio) throw limitReached();
			const [last] = await tx
				.select({ sortOrder: max(portfolioPhoto.sortOrder) })
				.from(portfolioPhoto)
				.where(eq(portfolioPhoto.itemId, itemId));
			const [row] = await tx
				.insert(portfolioPhoto)
				.values({ itemId, ...photoRow(stored, input.altText, (last?.sortOrder ?? -1) + 1) })
				.returning(photoColumns);
			await audit.record(tx, {
				actorId: actor.id,
				action: 'portfolio.photo_added',
				subjectType: 'portfolio_item',
				subjectId: itemId,
				data: { photoId: row.id }
			});
			return toView(row);
		})
	);
}

/** Narrows a photo to one of the actor's items; `itemId`, when given, must be the photo's item. */
function ownPhoto(actor: Person, photoId: string, itemId?: string) {
	return and(
		eq(portfolioPhoto.id, photoId),
		inArray(
			portfolioPhoto.itemId,
			itemId
				? sql`(select ${portfolioItem.id} from ${portfolioItem} where ${portfolioItem.id} = ${itemId} and ${portfolioItem.tailorId} = ${actor.id})`
				: sql`(select ${portfolioItem.id} from ${portfolioItem} where ${portfolioItem.tailorId} = ${actor.id})`
		)
	);
}

/** Removes one photo and its stored images. Call it outside a transaction. */
export async function removePhoto(db: Executor, input: { actor: Person; photoId: string; itemId?: string }) {
	const { actor, photoId } = input;
	const removed = await db.transaction(async (tx) => {
		const [row] = await tx
			.delete(portfolioPhoto)
			.where(ownPhoto(actor, photoId, input.itemId))
			.returning({
				storageKey: portfolioPhoto.storageKey,
				thumbKey: portfolioPhoto.thumbKey,
				itemId: portfolioPhoto.itemId
			});
		if (!row) throw notFound();
		await audit.record(tx, {
			actorId: actor.id,
			action: 'portfolio.photo_removed',
			subjectType: 'portfolio_item',
			subjectId: row.itemId,
			data: { photoId }
		});
		return row;
	});
	await forgetObjects([removed]);
}

export async function setPhotoAltText(
	db: Executor,
	input: { actor: Person; photoId: string; itemId?: string; altText: string }
): Promise<PhotoView> {
	const [row] = await db
		.update(portfolioPhoto)
		.set({ altText: input.altText })
		.where(ownPhoto(input.actor, input.photoId, input.itemId))
		.returning(photoColumns);
	if (!row) throw notFound();
	return toView(row);
}

/** Puts an item's photos in the order of `ids`, which must list each of them once. */
export async function reorderPhotos(
	db: Executor,
	input: { actor: Person; itemId: string; ids: string[] }
): Promise<PortfolioItemView> {
	const { actor, itemId, ids } = input;
	await db.transaction(async (tx) => {
		await ownItem(tx, actor, itemId);
		const current = await tx
			.select({ id: portfolioPhoto.id })
			.from(portfolioPhoto)
			.where(eq(portfolioPhoto.itemId, itemId));
		checkOrder(
			current.map((photo) => photo.id),
			ids
		);
		for (const [index, id] of ids.entries()) {
			await tx.update(portfolioPhoto).set({ sortOrder: index }).where(eq(portfolioPhoto.id, id));
		}
	});
	return itemView(db, actor, itemId);
}

/** Moves one item `offset` places in the workroom's portfolio. */
export async function moveItem(db: Executor, input: { actor: Person; itemId: string; offset: number }) {
	const current = (await listItems(db, { tailorId: input.actor.id })).map((item) => item.id);
	const ids = moved(current, input.itemId, input.offset);
	if (!ids) throw notFound();
	return reorderItems(db, { actor: input.actor, ids });
}

/** Moves one photo `offset` places within its item. */
export async function movePhoto(
	db: Executor,
	input: { actor: Person; itemId: string; photoId: string; offset: number }
) {
	const item = await itemView(db, input.actor, input.itemId);
	const ids = moved(
		item.photos.map((photo) => photo.id),
		input.photoId,
		input.offset
	);
	if (!ids) throw notFound();
	return reorderPhotos(db, { actor: input.actor, itemId: input.itemId, ids });
}

/** The stored keys of a portfolio photo: portfolios are public. */
export async function viewableKeys(db: Executor, input: { photoId: string }) {
	const [photo] = await db
		.select({ key: portfolioPhoto.storageKey, thumbKey: portfolioPhoto.thumbKey })
		.from(portfolioPhoto)
		.where(eq(portfolioPhoto.id, input.photoId));
	return photo ?? null;
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
