import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { portfolio } from '$lib/server/photos';
import * as workrooms from '$lib/server/workrooms';
import { altTextBody, answer } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** `{ altText }` → 200 the photo. */
export const PATCH: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('tailor');
	const body = await parseJsonBody(request, altTextBody);
	if (!body.ok) return body.response;
	const { itemId, photoId } = params;
	return answer(() => portfolio.setPhotoAltText(locals.db, { actor, itemId, photoId, altText: body.data.altText }));
};

export const DELETE: RequestHandler = async ({ params, locals }) => {
	const actor = requireRole('tailor');
	const { itemId, photoId } = params;
	const response = await answer(() => portfolio.removePhoto(locals.db, { actor, itemId, photoId }), 204);
	await workrooms.onboardingStatus(locals.db, { tailorId: actor.id });
	return response;
};
