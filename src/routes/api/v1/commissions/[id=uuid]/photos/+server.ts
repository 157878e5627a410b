import { error, json } from '@sveltejs/kit';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { commissionPhotos } from '$lib/server/photos';
import { answer, orderBody, readUpload } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** The commission's photos in order, for anyone who may see them. */
export const GET: RequestHandler = async ({ params, locals }) => {
	const viewer = requireUser();
	const items = await commissionPhotos.list(locals.db, { commissionId: params.id, viewer });
	if (!items) error(404, { message: 'There is no such commission.', code: 'not_found' });
	return json({ items });
};

/** multipart/form-data with the image in `file` (and optionally `altText`) → 201 `{ id, url, thumbUrl, width, height }`. */
export const POST: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('customer');
	const upload = await readUpload(request);
	if (!upload.ok) return upload.response;
	return answer(
		() =>
			commissionPhotos.add(locals.db, { commissionId: params.id, actor, file: upload.file, altText: upload.altText }),
		201
	);
};

/** `{ order: [photoId, …] }` naming every photo once → 200 `{ items }` in that order. */
export const PATCH: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('customer');
	const body = await parseJsonBody(request, orderBody);
	if (!body.ok) return body.response;
	return answer(async () => ({
		items: await commissionPhotos.reorder(locals.db, { commissionId: params.id, actor, ids: body.data.order })
	}));
};
