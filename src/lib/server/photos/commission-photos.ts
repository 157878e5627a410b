import { and, asc, count, eq, max } from 'drizzle-orm';
import type { SessionUser } from '$lib/types/user';
import { photoLimits, type PhotoView } from '$lib/types/photos';
import * as audit from '../audit';
import type { Executor } from '../db';
import { commissionPhoto } from '../db/schema';
import { commissionFacts, type CommissionFacts } from './commission-access';
import { PhotoRuleBroken, notFound } from './errors';
import {
	checkOrder,
	forgetObjects,
	moved,
	photoRow,
	storeUpload,
	toView,
	type StoredPhoto,
	type Upload
} from './stored';

export type Person = Pick<SessionUser, 'id' | 'role'>;

const editableStatuses = new Set(['draft', 'open']);
const viewColumns = {
	id: commissionPhoto.id,
	width: commissionPhoto.width,
	height: commissionPhoto.height,
	altText: commissionPhoto.altText
};

/** the owner, admins, signed-in tailors while it is open, and the awarded tailor afterwards. */
function mayView(facts: CommissionFacts, viewer: Person | null) {
	if (!viewer) return false;
	if (viewer.role === 'admin' || facts.customerId === viewer.id) return true;
	if (viewer.role === 'tailor' && facts.status === 'open') return true;
	return facts.awardedTailorId === viewer.id;
}

/** The commission, if `actor` owns it and it still takes photo changes; others get `not_found`. */
async function editable(db: Executor, commissionId: string, actor: Person, lock = false) {
	const facts = await commissionFacts(db, commissionId, { lock });
	if (!facts || facts.customerId !== actor.id) throw notFound();
	if (!editableStatuses.has(facts.status)) {
		throw new PhotoRuleBroken(
			'not_editable',
			'Photos can be changed only while the commission is a draft or open for quotes.'
		);
	}
	return facts;
}

async function countAndLast(db: Executor, commissionId: string) {
	const [row] = await db
		.select({ photos: count(), last: max(commissionPhoto.sortOrder) })
		.from(commissionPhoto)
		.where(eq(commissionPhoto.commissionId, commissionId));
	return { photos: row?.photos ?? 0, last: row?.last ?? -1 };
}

function limitReached() {
	return new PhotoRuleBroken(
		'photo_limit',
		`A commission holds at most ${photoLimits.commission} photos. Remove one before adding another.`
	);
}

async function rows(db: Executor, commissionId: string) {
	return db
		.select(viewColumns)
		.from(commissionPhoto)
		.where(eq(commissionPhoto.commissionId, commissionId))
		.orderBy(asc(commissionPhoto.sortOrder), asc(commissionPhoto.createdAt));
}

async function insert(
	tx: Executor,
	input: { commissionId: string; actorId: string | null; stored: StoredPhoto; altText?: string }
): Promise<PhotoView> {
	const { commissionId, stored } = input;
	const { photos, last } = await countAndLast(tx, commissionId);
	if (photos >= photoLimits.commission) throw limitReached();
	const [row] = await tx
		.insert(commissionPhoto)
		.values({ commissionId, ...photoRow(stored, input.altText, last + 1) })
		.returning(viewColumns);
	await audit.record(tx, {
		actorId: input.actorId,
		action: 'commission.photo_added',
		subjectType: 'commission',
		subjectId: commissionId,
		data: { photoId: row.id }
	});
	return toView(row);
}

/**
 * Adds a photo to the owner's draft or open commission (at most eight): checked, re-encoded and stored
 * before the row is written; a refused upload throws `PhotoRefused`, a broken rule `PhotoRuleBroken`.
 */
export async function add(
	db: Executor,
	input: { commissionId: string; actor: Person; file: Upload; altText?: string }
): Promise<PhotoView> {
	const { commissionId, actor } = input;
	await editable(db, commissionId, actor);
	// Checked before the expensive work, and again under the lock when the row is written.
	if ((await countAndLast(db, commissionId)).photos >= photoLimits.commission) throw limitReached();
	return storeUpload(input.file, (stored) =>
		db.transaction(async (tx) => {
			await editable(tx, commissionId, actor, true);
			return insert(tx, { commissionId, actorId: actor.id, stored, altText: input.altText });
		})
	);
}

/**
 * Adds a photo whatever the commission's status or owner, within the same limit. For the demo seed and
 * scripts only; requests go through `add`.
 */
export async function addWithoutChecks(
	db: Executor,
	input: { commissionId: string; file: Upload; altText?: string }
): Promise<PhotoView> {
	return storeUpload(input.file, (stored) =>
		db.transaction(async (tx) => {
			if (!(await commissionFacts(tx, input.commissionId, { lock: true }))) throw notFound();
			return insert(tx, { commissionId: input.commissionId, actorId: null, stored, altText: input.altText });
		})
	);
}

/** Removes a photo and its stored images. Call it outside a transaction: the objects go once the row has. */
export async function remove(db: Executor, input: { commissionId: string; photoId: string; actor: Person }) {
	const { commissionId, photoId, actor } = input;
	const removed = await db.transaction(async (tx) => {
		await editable(tx, commissionId, actor, true);
		const [row] = await tx
			.delete(commissionPhoto)
			.where(and(eq(commissionPhoto.id, photoId), eq(commissionPhoto.commissionId, commissionId)))
			.returning({ storageKey: commissionPhoto.storageKey, thumbKey: commissionPhoto.thumbKey });
		if (!row) throw notFound();
		await audit.record(tx, {
			actorId: actor.id,
			action: 'commission.photo_removed',
			subjectType: 'commission',
			subjectId: commissionId,
			data: { photoId }
		});
		return row;
	});
	await forgetObjects([removed]);
}

/** Puts the commission's photos in the order of `ids`, which must list each of them once. */
export async function reorder(
	db: Executor,
	input: { commissionId: string; actor: Person; ids: string[] }
): Promise<PhotoView[]> {
	const { commissionId, actor, ids } = input;
	return db.transaction(async (tx) => {
		await editable(tx, commissionId, actor, true);
		checkOrder(
			(await rows(tx, commissionId)).map((row) => row.id),
			ids
		);
		for (const [index, id] of ids.entries()) {
			await tx.update(commissionPhoto).set({ sortOrder: index }).where(eq(commissionPhoto.id, id));
		}
		await audit.record(tx, {
			actorId: actor.id,
			action: 'commission.photos_reordered',
			subjectType: 'commission',
			subjectId: commissionId
		});
		return (await rows(tx, commissionId)).map(toView);
	});
}

/** Moves one photo `offset` places (−1 earlier, 1 later): the buttons beside each photo. */
export async function move(
	db: Executor,
	input: { commissionId: string; photoId: string; actor: Person; offset: number }
): Promise<PhotoView[]> {
	const { commissionId, actor } = input;
	const current = (await rows(db, commissionId)).map((row) => row.id);
	const ids = moved(current, input.photoId, input.offset);
	if (!ids) {
		await editable(db, commissionId, actor);
		throw notFound();
	}
	return reorder(db, { commissionId, actor, ids });
}

/** Sets the description read out in place of the photo (already validated for length). */
export async function setAltText(
	db: Executor,
	input: { commissionId: string; photoId: string; actor: Person; altText: string }
): Promise<PhotoView> {
	const { commissionId, photoId, actor, altText } = input;
	return db.transaction(async (tx) => {
		await editable(tx, commissionId, actor, true);
		const [row] = await tx
			.update(commissionPhoto)
			.set({ altText })
			.where(and(eq(commissionPhoto.id, photoId), eq(commissionPhoto.commissionId, commissionId)))
			.returning(viewColumns);
		if (!row) throw notFound();
		return toView(row);
	});
}

/** The commission's photos in order, or null when `viewer` may not see them (or it does not exist). */
export async function list(
	db: Executor,
	input: { commissionId: string; viewer: Person | null }
): Promise<PhotoView[] | null> {
	const facts = await commissionFacts(db, input.commissionId);
	if (!facts || !mayView(facts, input.viewer)) return null;
	return (await rows(db, input.commissionId)).map(toView);
}

/** How many photos a commission has. */
export async function photoCount(db: Executor, input: { commissionId: string }) {
	return (await countAndLast(db, input.commissionId)).photos;
}

/** The owner's view for editing: the photos and whether they may still change; null for anyone else. */
export async function forOwner(db: Executor, input: { commissionId: string; actor: Person }) {
	const facts = await commissionFacts(db, input.commissionId);
	if (!facts || facts.customerId !== input.actor.id) return null;
	return {
		status: facts.status,
		editable: editableStatuses.has(facts.status),
		photos: (await rows(db, input.commissionId)).map(toView)
	};
}

/** The stored keys of a commission photo, if `viewer` may see it; null otherwise or when there is none. */
export async function viewableKeys(db: Executor, input: { photoId: string; viewer: Person | null }) {
	if (!input.viewer) return null;
	const [photo] = await db
		.select({
			commissionId: commissionPhoto.commissionId,
			key: commissionPhoto.storageKey,
			thumbKey: commissionPhoto.thumbKey
		})
		.from(commissionPhoto)
		.where(eq(commissionPhoto.id, input.photoId));
	if (!photo) return null;
	const facts = await commissionFacts(db, photo.commissionId);
	return facts && mayView(facts, input.viewer) ? { key: photo.key, thumbKey: photo.thumbKey } : null;
}

/** Whether `viewer` may see this commission photo. */
export async function canView(db: Executor, input: { photoId: string; viewer: Person | null }) {
	return (await viewableKeys(db, input)) !== null;
}

/**
 * Deletes every photo row of a commission and then its stored images: call it before deleting the
 * commission itself (the rows would go by cascade, the objects would not). No permission check.
 */
export async function discardAll(db: Executor, input: { commissionId: string }) {
	const removed = await db
		.delete(commissionPhoto)
		.where(eq(commissionPhoto.commissionId, input.commissionId))
		.returning({ storageKey: commissionPhoto.storageKey, thumbKey: commissionPhoto.thumbKey });
	await forgetObjects(removed);
	return removed.length;
}
