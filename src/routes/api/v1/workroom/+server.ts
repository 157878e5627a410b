import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import { clientAddress } from '$lib/server/limits/handle';
import * as workrooms from '$lib/server/workrooms';
import { onboardingJson, ownWorkroomJson } from '$lib/server/workrooms/api';
import type { RequestHandler } from './$types';

/** The signed-in tailor's own workroom and what onboarding still needs; 404 before it is started. */
export const GET: RequestHandler = async ({ locals }) => {
	const tailor = requireRole('tailor');
	const workroom = await workrooms.getOwn(locals.db, { tailorId: tailor.id });
	if (!workroom) return apiError(404, 'not_found', 'You have not set up a workroom yet.');
	const onboarding = await workrooms.onboardingStatus(locals.db, { tailorId: tailor.id });
	return json({ workroom: ownWorkroomJson(workroom), onboarding: onboardingJson(onboarding) });
};

/** Replaces every onboarding field of the tailor's own workroom (made on the first call). */
export const PUT: RequestHandler = async (event) => {
	const tailor = requireRole('tailor');
	const parsed = await parseJsonBody(event.request, workrooms.workroomReplace);
	if (!parsed.ok) return parsed.response;
	let saved;
	try {
		saved = await workrooms.save(event.locals.db, {
			tailorId: tailor.id,
			input: parsed.data,
			ip: clientAddress(event)
		});
	} catch (error) {
		if (!(error instanceof workrooms.UnknownPlace)) throw error;
		const path = 'placeId' in parsed.data.location ? 'location.placeId' : 'location';
		return apiError(400, 'invalid_input', 'The request has invalid fields.', [{ path, message: error.message }]);
	}
	return json({ workroom: ownWorkroomJson(saved.workroom), onboarding: onboardingJson(saved.onboarding) });
};
