import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { readForm } from '$lib/server/forms';
import { signOut } from '$lib/server/auth';
import type { Actions, PageServerLoad } from './$types';

// Signing out is a POST only; a GET (a prefetch, a pasted link) just goes home.
export const load: PageServerLoad = () => redirect(303, '/');

export const actions: Actions = {
	default: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { errors: form.errors });
		// Auth.js takes its options from the submitted fields; hand it a fixed body instead of whatever was sent.
		const headers = new Headers(event.request.headers);
		headers.delete('content-length');
		headers.set('content-type', 'application/x-www-form-urlencoded');
		const request = new Request(event.request.url, {
			method: 'POST',
			headers,
			body: new URLSearchParams({ redirectTo: '/' })
		});
		try {
			await signOut({ ...event, request });
		} catch (error) {
			// Auth.js answers with a redirect of its own; where to go is ours to decide.
			if (!isRedirect(error)) throw error;
		}
		redirect(303, '/');
	}
};
