import { photoUrl, type PhotoView } from '$lib/types/photos';
import { PhotoRefused, maxUploadBytes, processUpload } from './process';
import { deletePhoto, storePhoto, type PhotoKeys } from './store';
import { PhotoRuleBroken } from './errors';

/** An upload as a form or the API hands it over. */
export type Upload = Blob | Uint8Array;

/** What a photo row keeps about the stored objects. */
export type StoredPhoto = PhotoKeys & { width: number; height: number; bytes: number; contentType: 'image/webp' };

async function bytesOf(file: Upload): Promise<Uint8Array> {
	if (file instanceof Uint8Array) return file;
	// Refused before reading it all: the size is known from the part's header.
	if (file.size > maxUploadBytes) throw new PhotoRefused('too_large');
	return new Uint8Array(await file.arrayBuffer());
}

/**
 * Checks and re-encodes an upload, stores it, then runs `save` (the row insert) with what was stored.
 * If `save` throws, the stored objects are removed again, so no object outlives a refused row.
 */
export async function storeUpload<T>(file: Upload, save: (photo: StoredPhoto) => Promise<T>): Promise<T> {
	const photo = await processUpload(await bytesOf(file));
	const keys = await storePhoto(photo);
	try {
		return await save({
			...keys,
			width: photo.width,
			height: photo.height,
			bytes: photo.bytes.byteLength,
			contentType: 'image/webp'
		});
	} catch (error) {
		await deletePhoto(keys).catch(() => undefined);
		throw error;
	}
}

/** The columns every photo row shares, for a stored photo placed at `sortOrder`. */
export function photoRow(stored: StoredPhoto, altText: string | undefined, sortOrder: number) {
	const { key, thumbKey, contentType, bytes, width, height } = stored;
	return { storageKey: key, thumbKey, contentType, bytes, width, height, altText: altText ?? '', sortOrder };
}

/** Removes stored objects of rows already deleted; a failure is logged, never undoes the delete. */
export async function forgetObjects(rows: { storageKey: string; thumbKey: string | null }[]) {
	const results = await Promise.allSettled(
		rows.map((row) => deletePhoto({ key: row.storageKey, thumbKey: row.thumbKey }))
	);
	for (const result of results) {
		if (result.status === 'rejected') console.error('photo objects left behind in storage:', result.reason);
	}
}

/** `ids` must name each of `current` exactly once. */
export function checkOrder(current: string[], ids: string[]) {
	const wanted = new Set(ids);
	if (wanted.size !== ids.length || ids.length !== current.length || current.some((id) => !wanted.has(id))) {
		throw new PhotoRuleBroken('invalid_order', 'The new order must list every photo exactly once.');
	}
}

/** `ids` with `id` moved `offset` places (clamped to the ends). */
export function moved(ids: string[], id: string, offset: number) {
	const from = ids.indexOf(id);
	if (from < 0) return null;
	const to = Math.min(ids.length - 1, Math.max(0, from + offset));
	const next = ids.filter((other) => other !== id);
	next.splice(to, 0, id);
	return next;
}

export function toView(row: { id: string; width: number; height: number; altText: string }): PhotoView {
	return {
		id: row.id,
		url: photoUrl(row.id, 'full'),
		thumbUrl: photoUrl(row.id, 'thumb'),
		width: row.width,
		height: row.height,
		altText: row.altText
	};
}
