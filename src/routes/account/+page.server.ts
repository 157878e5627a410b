import { error, fail } from '@sveltejs/kit';
import * as accounts from '$lib/server/accounts';
import { passwordChange, profileUpdate } from '$lib/server/accounts/schemas';
import { requireUser } from '$lib/server/auth/guard';
import { timeZoneGroups } from '$lib/format/time-zones';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import * as limits from '$lib/server/limits';
import { clientAddress } from '$lib/server/limits/handle';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireUser();
	const profile = await accounts.getProfile(locals.db, { id: user.id });
	if (!profile) error(404, { message: 'Account not found.' });
	return {
		profile,
		needsCurrentPassword: profile.hasPassword && !locals.recentLinkSignIn,
		timeZones: timeZoneGroups(new Date())
	};
};

export const actions: Actions = {
	profile: async ({ request, locals }) => {
		const user = requireUser();
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { action: 'profile' as const, values: form.values, errors: form.errors });
		const formData = form.data;
		const values = keepValues(formData, ['name', 'units', 'timeZone']);
		const parsed = parseForm(profileUpdate, formData);
		if (!parsed.ok) return fail(400, { action: 'profile' as const, values, errors: parsed.errors });
		await accounts.updateProfile(locals.db, { userId: user.id, ...parsed.data });
		return { action: 'profile' as const, saved: true };
	},

	password: async (event) => {
		const { request, locals } = event;
		const user = requireUser();
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { action: 'password' as const, errors: form.errors });
		const parsed = parseForm(passwordChange(user), form.data);
		if (!parsed.ok) return fail(400, { action: 'password' as const, errors: parsed.errors });
		const gate = await limits.passwordChange({ userId: user.id, address: clientAddress(event) });
		if (!gate.allowed) {
			const wait = limits.minutesText(gate.retryAfterSeconds);
			return fail(429, { action: 'password' as const, errors: { form: [`Too many tries. Try again in ${wait}.`] } });
		}
		try {
			await accounts.changePassword(locals.db, {
				userId: user.id,
				currentPassword: parsed.data.currentPassword,
				newPassword: parsed.data.newPassword,
				maySkipCurrent: locals.recentLinkSignIn,
				keepSessionId: locals.sessionId
			});
		} catch (cause) {
			if (cause instanceof accounts.WrongPassword) {
				return fail(400, { action: 'password' as const, errors: { currentPassword: [cause.message] } });
			}
			throw cause;
		}
		return { action: 'password' as const, saved: true };
	}
};
