import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { commissionPhotos } from '$lib/server/photos';
import { altTextBody, answer } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** `{ altText }` → 200 with the photo. */
export const PATCH: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('customer');
	const body = await parseJsonBody(request, altTextBody);
	if (!body.ok) return body.response;
	return answer(() =>
		commissionPhotos.setAltText(locals.db, {
			commissionId: params.id,
			photoId: params.photoId,
			actor,
			altText: body.data.altText
		})
	);
};

export const DELETE: RequestHandler = async ({ params, locals }) => {
	const actor = requireRole('customer');
	return answer(
		() => commissionPhotos.remove(locals.db, { commissionId: params.id, photoId: params.photoId, actor }),
		204
	);
};
