import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { AuthError, CredentialsSignin } from '@auth/sveltekit';
import { callAuthSignIn } from '$lib/server/auth/sign-in';
import * as accounts from '$lib/server/accounts';
import { magicLinkRequest, passwordSignIn } from '$lib/server/accounts/schemas';
import { homeFor, safeRedirectTarget } from '$lib/server/auth/guard';
import * as limits from '$lib/server/limits';
import { clientAddress } from '$lib/server/limits/handle';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeRedirectTarget(url.searchParams.get('redirectTo'), homeFor(locals.user.role)));
	return { linkLifetimeMinutes: limits.SIGN_IN_LINK_LIFETIME_MINUTES };
};

const incorrect = 'Incorrect email or password. Just signed up? Open the link we emailed you first.';

export const actions: Actions = {
	password: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { action: 'password' as const, values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['email']);
		const parsed = parseForm(passwordSignIn, formData);
		if (!parsed.ok) return fail(400, { action: 'password' as const, values, errors: parsed.errors });

		const { email, password } = parsed.data;
		const gate = await limits.passwordSignIn({ email, address: clientAddress(event) });
		if (!gate.allowed) {
			const wait = limits.minutesText(gate.retryAfterSeconds);
			return fail(429, {
				action: 'password' as const,
				values,
				errors: { form: [`Too many failed sign-in attempts. Try again in ${wait}, or email yourself a sign-in link.`] }
			});
		}

		// Auth.js answers a success with a redirect to callbackUrl; where to go is decided after it.
		try {
			await callAuthSignIn(event, { providerId: 'credentials', email, password, redirectTo: '/' });
		} catch (error) {
			if (isRedirect(error)) {
				await limits.passwordSignInSucceeded({ email });
				const found = await accounts.findByEmail(event.locals.db, { email });
				redirect(303, safeRedirectTarget(parsed.data.redirectTo, found ? homeFor(found.role) : '/'));
			}
			if (error instanceof CredentialsSignin && error.code === 'suspended') {
				return fail(403, {
					action: 'password' as const,
					values,
					errors: {
						form: ['This account is suspended. Write to support@tackline.test if you think this is a mistake.']
					}
				});
			}
			if (error instanceof AuthError) {
				return fail(400, { action: 'password' as const, values, errors: { form: [incorrect] } });
			}
			throw error;
		}
	},

	magicLink: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { action: 'magicLink' as const, values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['email']);
		const parsed = parseForm(magicLinkRequest, formData);
		if (!parsed.ok) return fail(400, { action: 'magicLink' as const, values, errors: parsed.errors });

		const { email } = parsed.data;
		// The same limit, work and answer whether or not the address has an account: the mail says which.
		const gate = await limits.signInLink({ email, address: clientAddress(event) });
		if (!gate.allowed) {
			return fail(429, {
				action: 'magicLink' as const,
				values,
				errors: {
					form: [
						`We have sent several links to this address recently. Try again in ${limits.minutesText(gate.retryAfterSeconds)}.`
					]
				}
			});
		}
		const redirectTo = safeRedirectTarget(parsed.data.redirectTo, '/sign-in/continue');
		await accounts.forgetUnconfirmedPassword(event.locals.db, { email });
		try {
			await callAuthSignIn(event, { providerId: 'nodemailer', email, redirectTo });
		} catch (error) {
			if (!isRedirect(error)) throw error;
		}
		return { action: 'magicLink' as const, sent: true, email };
	}
};
