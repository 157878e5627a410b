import { json } from '@sveltejs/kit';
import { draftGarment, draftRequestSchema, implausibleCodes } from '$lib/drafting';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request }) => {
	const parsed = await parseJsonBody(request, draftRequestSchema);
	if (!parsed.ok) return parsed.response;
	const draft = draftGarment(parsed.data);
	const implausible = draft.errors.filter((e) => implausibleCodes.has(e.code));
	if (implausible.length)
		return apiError(
			422,
			'implausible_measurements',
			implausible.some((e) => e.code === 'unit_mixup')
				? 'Some measurements look like another unit. Correct them, change the unit, or send unitConfirmed: true if they are right.'
				: 'Some measurements cannot be right. Please correct them.',
			implausible.flatMap((e) => e.fields.map((field) => ({ path: `measurements.${field}`, message: e.message })))
		);
	return json(draft);
};
