import { fail, isRedirect, redirect } from '@sveltejs/kit';
import { AuthError, CredentialsSignin } from '@auth/sveltekit';
import { callAuthSignIn } from '$lib/server/auth/sign-in';
import * as accounts from '$lib/server/accounts';
import { magicLinkRequest, passwordSignIn } from '$lib/server/accounts/schemas';
import { homeFor, safeRedirectTarget } from '$lib/server/auth/guard';
import { checkMagicLinkGate, checkSignInGate, recordAttempt } from '$lib/server/auth/rate-limit';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeRedirectTarget(url.searchParams.get('redirectTo'), homeFor(locals.user.role)));
};

export const actions: Actions = {
	password: async (event) => {
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { action: 'password' as const, values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['email']);
		const parsed = parseForm(passwordSignIn, formData);
		if (!parsed.ok) return fail(400, { action: 'password' as const, values, errors: parsed.errors });

		const { email, password } = parsed.data;
		const ip = event.getClientAddress();
		const gate = await checkSignInGate({ email, ip });
		if (gate.blocked) {
			const minutes = `${gate.retryAfterMinutes} minute${gate.retryAfterMinutes === 1 ? '' : 's'}`;
			return fail(429, {
				action: 'password' as const,
				values,
				errors: {
					form: [`Too many failed sign-in attempts. Try again in ${minutes}, or email yourself a sign-in link.`]
				}
			});
		}

		const found = await accounts.findByEmail({ email });
		const redirectTo = safeRedirectTarget(parsed.data.redirectTo, found ? homeFor(found.role) : '/');
		try {
			await callAuthSignIn(event, { providerId: 'credentials', email, password, redirectTo });
		} catch (error) {
			if (isRedirect(error)) {
				await recordAttempt({ email, ip, succeeded: true });
				redirect(303, redirectTo);
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
				await recordAttempt({ email, ip, succeeded: false });
				return fail(400, { action: 'password' as const, values, errors: { form: ['Incorrect email or password.'] } });
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
		const gate = await checkMagicLinkGate({ email });
		if (gate.blocked) {
			return fail(429, {
				action: 'magicLink' as const,
				values,
				errors: {
					form: [`We have sent several links to this address recently. Try again in ${gate.retryAfterMinutes} minutes.`]
				}
			});
		}
		// The answer is the same whether or not the address has an account, so it reveals nothing.
		const found = await accounts.findByEmail({ email });
		if (found && !found.suspendedAt) {
			const redirectTo = safeRedirectTarget(parsed.data.redirectTo, homeFor(found.role));
			try {
				await callAuthSignIn(event, { providerId: 'nodemailer', email, redirectTo });
			} catch (error) {
				if (!isRedirect(error)) throw error;
			}
		}
		return { action: 'magicLink' as const, sent: true, email };
	}
};
