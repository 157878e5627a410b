import { error } from '@sveltejs/kit';
import { openForViewer, photoResponse } from '$lib/server/photos';
import type { RequestHandler } from './$types';

const notFound = { message: 'There is no such photo.', code: 'not_found' };

/**
 * A stored photo for whoever may see it (commission photos, portfolio photos for everyone);
 * everyone else gets the same 404 as for a photo that does not exist.
 */
export const GET: RequestHandler = async ({ params, locals, request }) => {
	const photo = await openForViewer(locals.db, { photoId: params.id, variant: params.variant, viewer: locals.user });
	if (!photo) error(404, notFound);
	return photoResponse(photo, request);
};
