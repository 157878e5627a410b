import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { callAuthSignOut } from '$lib/server/auth/sign-in';
import { readForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

// Signing out is a POST only; a GET (a prefetch, a pasted link) just goes home.
export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	/** Ends the session on the server too (Auth.js's signOut event), so a copied cookie stops working. */
	default: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { errors: form.errors });
		try {
			await callAuthSignOut(event);
		} catch (error) {
			// Auth.js answers with a redirect of its own; where to go is ours to decide.
			if (!isRedirect(error)) throw error;
		}
		redirect(303, '/');
	}
};
