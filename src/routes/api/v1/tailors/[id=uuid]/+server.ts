import { json } from '@sveltejs/kit';
import { apiError } from '$lib/server/http/respond';
import * as workrooms from '$lib/server/workrooms';
import { publicWorkroomJson } from '$lib/server/workrooms/api';
import type { RequestHandler } from './$types';

/** A tailor's public workroom by user id; 404 until onboarding is complete, and while suspended. */
export const GET: RequestHandler = async ({ locals, params }) => {
	const workroom = await workrooms.getPublic(locals.db, { slugOrId: params.id });
	if (!workroom) return apiError(404, 'not_found', 'There is no public workroom for this tailor.');
	return json(publicWorkroomJson(workroom));
};
