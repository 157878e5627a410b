import { json } from '@sveltejs/kit';
import { draftGarment, draftRequestSchema } from '$lib/drafting';
import { parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, draftRequestSchema);
	if (!parsed.ok) return parsed.response;
	return json(draftGarment(parsed.data));
};
