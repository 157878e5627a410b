import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { portfolio } from '$lib/server/photos';
import * as workrooms from '$lib/server/workrooms';
import { answer, orderBody, readUpload } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** multipart/form-data with the image in `file` (optionally `altText`) → 201 `{ id, url, thumbUrl, width, height, altText }`. */
export const POST: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('tailor');
	const upload = await readUpload(request);
	if (!upload.ok) return upload.response;
	const response = await answer(
		() => portfolio.addPhoto(locals.db, { actor, itemId: params.itemId, file: upload.file, altText: upload.altText }),
		201
	);
	await workrooms.onboardingStatus(locals.db, { tailorId: actor.id });
	return response;
};

/** `{ order: [photoId, …] }` naming every photo of the item once → 200 the item. */
export const PATCH: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('tailor');
	const body = await parseJsonBody(request, orderBody);
	if (!body.ok) return body.response;
	return answer(() => portfolio.reorderPhotos(locals.db, { actor, itemId: params.itemId, ids: body.data.order }));
};
