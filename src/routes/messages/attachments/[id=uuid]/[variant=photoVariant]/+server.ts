import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import * as messages from '$lib/server/messages';
import { photoResponse } from '$lib/server/photos';
import type { RequestHandler } from './$types';

const notFound = { message: 'There is no such photo.', code: 'not_found' };

/** A photo sent in a conversation, for its customer and tailor only; anyone else gets the same 404. */
export const GET: RequestHandler = async ({ params, locals, request }) => {
	const viewer = requireUser();
	const photo = await messages.openAttachment(locals.db, {
		attachmentId: params.id,
		variant: params.variant,
		viewer
	});
	if (!photo) error(404, notFound);
	return photoResponse(photo, request);
};
