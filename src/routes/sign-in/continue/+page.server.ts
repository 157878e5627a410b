import { redirect } from '@sveltejs/kit';
import { homeFor } from '$lib/server/auth/guard';
import type { PageServerLoad } from './$types';

/** Where an emailed link lands by default: each role's own starting page. */
export const load: PageServerLoad = ({ locals }) => {
	redirect(303, locals.user ? homeFor(locals.user.role) : '/sign-in');
};
