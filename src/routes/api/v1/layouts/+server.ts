import { json } from '@sveltejs/kit';
import { layoutRectangles, layoutRequestSchema } from '$lib/drafting';
import { parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, layoutRequestSchema);
	if (!parsed.ok) return parsed.response;
	return json(layoutRectangles(parsed.data));
};
