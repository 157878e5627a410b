import { fail, isRedirect, redirect } from '@sveltejs/kit';
import * as accounts from '$lib/server/accounts';
import { signUp } from '$lib/server/accounts/schemas';
import { homeFor } from '$lib/server/auth/guard';
import { callAuthSignIn } from '$lib/server/auth/sign-in';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
};

export const actions: Actions = {
	default: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['name', 'email', 'role']);
		const parsed = parseForm(signUp, formData);
		if (!parsed.ok) return fail(400, { values, errors: parsed.errors });

		try {
			await accounts.register(parsed.data);
		} catch (error) {
			if (error instanceof accounts.EmailTaken) {
				return fail(400, {
					values,
					errors: {
						email: ['An account with this email address already exists. Sign in instead, or use another address.']
					}
				});
			}
			throw error;
		}

		const home = homeFor(parsed.data.role);
		try {
			await callAuthSignIn(event, {
				providerId: 'credentials',
				email: parsed.data.email,
				password: parsed.data.password,
				redirectTo: home
			});
		} catch (error) {
			if (!isRedirect(error)) throw error;
		}
		redirect(303, `${home}?welcome=1`);
	}
};
