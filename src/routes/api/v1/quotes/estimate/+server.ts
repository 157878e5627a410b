import { json } from '@sveltejs/kit';
import { estimateQuoteRequest, quoteRequestSchema } from '$lib/drafting';
import { parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, quoteRequestSchema);
	if (!parsed.ok) return parsed.response;
	return json(estimateQuoteRequest(parsed.data));
};
