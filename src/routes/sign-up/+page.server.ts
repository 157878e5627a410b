import { fail, isRedirect, redirect } from '@sveltejs/kit';
import * as accounts from '$lib/server/accounts';
import { signUp } from '$lib/server/accounts/schemas';
import { homeFor } from '$lib/server/auth/guard';
import { publicOrigin } from '$lib/server/auth/origin';
import { callAuthSignIn } from '$lib/server/auth/sign-in';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import * as limits from '$lib/server/limits';
import { clientAddress } from '$lib/server/limits/handle';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, homeFor(locals.user.role));
	return { sent: url.searchParams.get('sent') === '1', linkLifetimeMinutes: limits.SIGN_IN_LINK_LIFETIME_MINUTES };
};

export const actions: Actions = {
	/**
	 * A taken address gets exactly the answer a free one gets (its owner is told by mail), so nobody
	 * learns from this form who has an account. The new account signs in through its emailed link.
	 */
	default: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['name', 'email', 'role']);
		const parsed = parseForm(signUp, formData);
		if (!parsed.ok) return fail(400, { values, errors: parsed.errors });

		const gate = await limits.signUp({ email: parsed.data.email, address: clientAddress(event) });
		if (!gate.allowed) {
			return fail(429, {
				values,
				errors: { form: [`Too many sign-ups from here. Try again in ${limits.minutesText(gate.retryAfterSeconds)}.`] }
			});
		}

		const { created } = await accounts.register(event.locals.db, parsed.data, { origin: publicOrigin() });
		if (created) {
			try {
				await callAuthSignIn(event, {
					providerId: 'nodemailer',
					email: parsed.data.email,
					redirectTo: `${homeFor(parsed.data.role)}?welcome=1`
				});
			} catch (error) {
				if (!isRedirect(error)) throw error;
			}
		}
		redirect(303, '/sign-up?sent=1');
	}
};
