import { isRedirect, redirect } from '@sveltejs/kit';
import { signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

// Signing out is a POST only; a GET (a prefetch, a pasted link) just goes home.
export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	default: async (event) => {
		try {
			await signOut(event);
		} catch (error) {
			// Auth.js answers with a redirect of its own; where to go is ours to decide.
			if (!isRedirect(error)) throw error;
		}
		redirect(303, '/');
	}
};
