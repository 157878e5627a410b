import type { PhotoVariant } from '$lib/types/photos';
import type { Executor } from '../db';
import * as commissionPhotos from './commission-photos';
import * as portfolio from './portfolio';
import { readPhoto } from './store';

/**
 * A stored image for a same-origin route, after checking that `viewer` may see it: commission photos
 *, portfolio photos for everyone. Null when it does not exist or the viewer may not see it.
 */
export async function openForViewer(
	db: Executor,
	input: { photoId: string; variant: PhotoVariant; viewer: commissionPhotos.Person | null }
) {
	const keys = (await commissionPhotos.viewableKeys(db, input)) ?? (await portfolio.viewableKeys(db, input));
	if (!keys) return null;
	const key = input.variant === 'thumb' ? (keys.thumbKey ?? keys.key) : keys.key;
	const object = await readPhoto(key);
	if (!object) return null;
	// A key never gets new content (see storePhoto), so the key itself is a strong validator.
	return { ...object, etag: `"${key.split('/')[1]}-${input.variant}"` };
}
