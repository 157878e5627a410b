import { draftRequestSchema, patternPdfQuerySchema } from '$lib/drafting';
import { computeAnswer, refuseImplausible } from '$lib/server/compute/respond';
import { hasControlCharacters } from '$lib/server/http/body';
import { apiError, invalidInput, zodIssues } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

/**
 * GET /api/v1/drafts/pattern.pdf?paper=a4&request={…}: the draft's pieces at full size, tiled on A4 or
 * US Letter (paper=letter), or on one large sheet (paper=a0, paper=roll36).
 */
export const GET: RequestHandler = async ({ url }) => {
	const query = patternPdfQuerySchema.safeParse(Object.fromEntries(url.searchParams));
	if (!query.success) return invalidInput(query.error);
	if (hasControlCharacters(query.data.request))
		return apiError(400, 'invalid_input', 'The request has invalid fields.', [
			{ path: 'request', message: 'Contains control characters.' }
		]);
	let body: unknown;
	try {
		body = JSON.parse(query.data.request);
	} catch {
		return apiError(400, 'invalid_json', 'The request parameter must be JSON.');
	}
	const draft = draftRequestSchema.safeParse(body);
	if (!draft.success)
		return apiError(
			400,
			'invalid_input',
			'The request has invalid fields.',
			zodIssues(draft.error).map((i) => ({ ...i, path: `request.${i.path}` }))
		);
	return computeAnswer({ kind: 'pattern_pdf', request: draft.data, paper: query.data.paper }, (result) => {
		if (!result.ok)
			return (
				refuseImplausible(result.draft) ??
				apiError(
					422,
					'draft_incomplete',
					'This draft cannot be printed yet.',
					result.draft.errors.flatMap((e) =>
						e.fields.map((field) => ({ path: `request.${field}`, message: e.message }))
					)
				)
			);
		return new Response(result.pdf as Uint8Array<ArrayBuffer>, {
			headers: {
				'content-type': 'application/pdf',
				'content-disposition': `inline; filename="${draft.data.garment}-pattern-${query.data.paper}.pdf"`,
				'cache-control': 'private, max-age=0'
			}
		});
	});
};
