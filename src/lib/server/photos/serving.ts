import type { PhotoVariant } from '$lib/types/photos';
import type { Executor } from '../db';
import * as commissionPhotos from './commission-photos';
import * as portfolio from './portfolio';
import { readPhoto } from './store';

/** A stored image opened for a same-origin route, with a strong validator for conditional requests. */
export type OpenedPhoto = { body: ReadableStream<Uint8Array>; size: number; etag: string };

/**
 * Opens the wanted variant of a stored photo (the thumbnail falls back to the full image when there is
 * none). Null when the object is gone. Callers check who may see it first.
 */
export async function openVariant(
	keys: { key: string; thumbKey: string | null },
	variant: PhotoVariant
): Promise<OpenedPhoto | null> {
	const key = variant === 'thumb' ? (keys.thumbKey ?? keys.key) : keys.key;
	const object = await readPhoto(key);
	if (!object) return null;
	// A key never gets new content (see storePhoto), so the key itself is a strong validator.
	return { ...object, etag: `"${key.split('/')[1]}-${variant}"` };
}

/**
 * A stored image for a same-origin route, after checking that `viewer` may see it: commission photos
 *, portfolio photos for everyone. Null when it does not exist or the viewer may not see it.
 */
export async function openForViewer(
	db: Executor,
	input: { photoId: string; variant: PhotoVariant; viewer: commissionPhotos.Person | null }
): Promise<OpenedPhoto | null> {
	const keys = (await commissionPhotos.viewableKeys(db, input)) ?? (await portfolio.viewableKeys(db, input));
	if (!keys) return null;
	return openVariant(keys, input.variant);
}

/**
 * The HTTP answer for an opened photo: 304 when the browser already holds this variant, else the image.
 * Private: only this viewer's browser keeps a copy, and only for a while, as permissions can change.
 */
export async function photoResponse(photo: OpenedPhoto, request: Request): Promise<Response> {
	const headers = {
		'content-type': 'image/webp',
		'cache-control': 'private, max-age=600',
		etag: photo.etag,
		vary: 'cookie'
	};
	if (request.headers.get('if-none-match') === photo.etag) {
		await photo.body.cancel();
		return new Response(null, { status: 304, headers });
	}
	return new Response(photo.body, { headers: { ...headers, 'content-length': String(photo.size) } });
}
