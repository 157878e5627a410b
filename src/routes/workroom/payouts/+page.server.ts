import { fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import * as payouts from '$lib/server/payouts';
import type { Actions, PageServerLoad } from './$types';

/** `returned` after onboarding, `refresh` when a used or expired link sent the tailor back. */
const query = z.object({
	returned: z.literal('1').optional().catch(undefined),
	refresh: z.literal('1').optional().catch(undefined)
});

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('tailor');
	const { returned, refresh } = query.parse(Object.fromEntries(url.searchParams));
	let state = await payouts.stateOf(locals.db, user.id);
	let unreachable = false;
	// Back from onboarding: read the account now rather than wait for its webhook.
	if ((returned || refresh) && state?.accountId && state.status !== 'enabled') {
		try {
			state = await payouts.refresh(locals.db, user.id);
		} catch {
			unreachable = true;
		}
	}
	return {
		hasWorkroom: state !== null,
		status: state?.status ?? 'not_connected',
		returned: Boolean(returned),
		expired: Boolean(refresh),
		unreachable
	};
};

export const actions: Actions = {
	/** Creates the payout account once and sends the tailor to onboarding (again, to continue it). */
	setUp: async ({ locals, getClientAddress }) => {
		const user = requireRole('tailor');
		let url: string;
		try {
			({ url } = await payouts.startOnboarding(locals.db, { id: user.id, email: user.email, ip: getClientAddress() }));
		} catch (problem) {
			if (!(problem instanceof payouts.PayoutError)) throw problem;
			return fail(problem.code === 'not_found' ? 409 : 503, { message: problem.message });
		}
		redirect(303, url);
	}
};
