import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { portfolio } from '$lib/server/photos';
import { answer, orderBody, portfolioItemBody } from '$lib/server/photos/api';
import type { RequestHandler } from './$types';

/** The signed-in tailor's portfolio: items in order, each with its photos. */
export const GET: RequestHandler = async ({ locals }) => {
	const actor = requireRole('tailor');
	const items = await portfolio.listItems(locals.db, { tailorId: actor.id });
	return json({ items, photoCount: items.reduce((sum, item) => sum + item.photos.length, 0) });
};

/** `{ caption, garmentType? }` → 201 the new, empty item. */
export const POST: RequestHandler = async ({ locals, request }) => {
	const actor = requireRole('tailor');
	const body = await parseJsonBody(request, portfolioItemBody);
	if (!body.ok) return body.response;
	return answer(() => portfolio.createItem(locals.db, { actor, ...body.data }), 201);
};

/** `{ order: [itemId, …] }` naming every item once → 200 `{ items }`. */
export const PATCH: RequestHandler = async ({ locals, request }) => {
	const actor = requireRole('tailor');
	const body = await parseJsonBody(request, orderBody);
	if (!body.ok) return body.response;
	return answer(async () => ({ items: await portfolio.reorderItems(locals.db, { actor, ids: body.data.order }) }));
};
