import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import * as quotes from '$lib/server/quotes';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = requireUser();
	const view = await commissions.getForViewer(locals.db, { id: params.id, viewer: user, unit: user.units });
	if (!view) error(404, { message: 'There is no such commission.', code: 'not_found' });
	const myQuote =
		view.viewer === 'tailor'
			? await quotes.latestQuoteOf(locals.db, { commissionId: view.id, tailorId: user.id })
			: null;
	return {
		view,
		myQuote: myQuote && quotes.quoteJson(myQuote),
		confirmCancel: url.searchParams.has('cancel') && view.viewer === 'owner',
		published: url.searchParams.has('published'),
		saved: url.searchParams.has('saved')
	};
};

export const actions: Actions = {
	cancel: async ({ locals, params, getClientAddress }) => {
		const user = requireRole('customer');
		try {
			await commissions.cancel(locals.db, {
				id: params.id,
				actor: { id: user.id, role: user.role, ip: getClientAddress() }
			});
		} catch (cause) {
			if (!(cause instanceof commissions.CommissionError)) throw cause;
			if (cause.code === 'not_found') error(404, { message: cause.message, code: 'not_found' });
			return fail(409, { errors: { form: [cause.message] } });
		}
		redirect(303, `/commissions/${params.id}`);
	}
};
