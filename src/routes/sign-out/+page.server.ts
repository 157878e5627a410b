import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { readForm } from '$lib/server/forms';
import { signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

// Signing out is a POST only; a GET (a prefetch, a pasted link) just goes home.
export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	default: async (event) => {
		// Auth.js reads the body as a form itself; refuse anything else here rather than let it throw.
		const form = await readForm(event.request.clone());
		if (!form.ok) return fail(form.status, { errors: form.errors });
		try {
			await signOut(event);
		} catch (error) {
			// Auth.js answers with a redirect of its own; where to go is ours to decide.
			if (!isRedirect(error)) throw error;
		}
		redirect(303, '/');
	}
};
