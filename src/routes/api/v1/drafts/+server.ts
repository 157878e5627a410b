import { draftRequestSchema, implausibleCodes, type DraftResponse } from '$lib/drafting';
import { computeResponse } from '$lib/server/compute/respond';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

/** A draft from values no body has, or from an unconfirmed unit mix-up, is refused rather than drawn. */
function refuseImplausible(draft: DraftResponse) {
	const implausible = draft.errors.filter((e) => implausibleCodes.has(e.code));
	if (!implausible.length) return null;
	return apiError(
		422,
		'implausible_measurements',
		implausible.some((e) => e.code === 'unit_mixup')
			? 'Some measurements look like another unit. Correct them, change the unit, or send unitConfirmed: true if they are right.'
			: 'Some measurements cannot be right. Please correct them.',
		implausible.flatMap((e) => e.fields.map((field) => ({ path: `measurements.${field}`, message: e.message })))
	);
}

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, draftRequestSchema);
	if (!parsed.ok) return parsed.response;
	return computeResponse({ kind: 'draft', request: parsed.data }, refuseImplausible);
};
