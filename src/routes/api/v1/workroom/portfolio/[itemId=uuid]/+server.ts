import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { portfolio } from '$lib/server/photos';
import * as workrooms from '$lib/server/workrooms';
import { answer, portfolioItemBody } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** `{ caption, garmentType? }` → 200 the item. */
export const PATCH: RequestHandler = async ({ params, locals, request }) => {
	const actor = requireRole('tailor');
	const body = await parseJsonBody(request, portfolioItemBody);
	if (!body.ok) return body.response;
	return answer(() => portfolio.updateItem(locals.db, { actor, itemId: params.itemId, ...body.data }));
};

/** Removes the item with its photos → 204. */
export const DELETE: RequestHandler = async ({ params, locals }) => {
	const actor = requireRole('tailor');
	const response = await answer(() => portfolio.removeItem(locals.db, { actor, itemId: params.itemId }), 204);
	await workrooms.onboardingStatus(locals.db, { tailorId: actor.id });
	return response;
};
