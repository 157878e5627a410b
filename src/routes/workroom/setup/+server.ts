import { redirect } from '@sveltejs/kit';
import { sectionOf } from '$lib/components/workrooms/steps';
import { requireRole } from '$lib/server/auth/guard';
import * as workrooms from '$lib/server/workrooms';
import type { RequestHandler } from './$types';

/** Setup opens at the first section with something missing (the first section once everything is done). */
export const GET: RequestHandler = async ({ locals }) => {
	const tailor = requireRole('tailor');
	const { missing } = await workrooms.onboardingStatus(locals.db, { tailorId: tailor.id });
	const section = missing.length ? sectionOf(missing[0].step) : 'workroom';
	redirect(303, section === 'portfolio' ? '/workroom/portfolio' : `/workroom/setup/${section}`);
};
