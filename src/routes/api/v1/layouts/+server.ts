import { json } from '@sveltejs/kit';
import { layoutRectangles, layoutRequestSchema } from '$lib/drafting';
import { invalidInput, readJson } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const body = await readJson(request);
	if (!body.ok) return body.response;
	const parsed = layoutRequestSchema.safeParse(body.body);
	if (!parsed.success) return invalidInput(parsed.error);
	return json(layoutRectangles(parsed.data));
};
