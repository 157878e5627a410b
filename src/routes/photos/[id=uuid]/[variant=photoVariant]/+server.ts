import { error } from '@sveltejs/kit';
import { openForViewer } from '$lib/server/photos';
import type { RequestHandler } from './$types';

const notFound = { message: 'There is no such photo.', code: 'not_found' };

/**
 * A stored photo for whoever may see it (commission photos, portfolio photos for everyone);
 * everyone else gets the same 404 as for a photo that does not exist.
 */
export const GET: RequestHandler = async ({ params, locals, request }) => {
	const photo = await openForViewer(locals.db, { photoId: params.id, variant: params.variant, viewer: locals.user });
	if (!photo) error(404, notFound);
	const headers = {
		'content-type': 'image/webp',
		// Private: only this viewer's browser keeps a copy, and only for a while, as permissions can change.
		'cache-control': 'private, max-age=600',
		etag: photo.etag,
		vary: 'cookie'
	};
	if (request.headers.get('if-none-match') === photo.etag) {
		await photo.body.cancel();
		return new Response(null, { status: 304, headers });
	}
	return new Response(photo.body, { headers: { ...headers, 'content-length': String(photo.size) } });
};
