import { draftRequestSchema } from '$lib/drafting';
import { computeResponse } from '$lib/server/compute/respond';
import { parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, draftRequestSchema);
	if (!parsed.ok) return parsed.response;
	return computeResponse({ kind: 'draft', request: parsed.data });
};
