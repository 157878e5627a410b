import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { loadStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const step = await loadStep(locals, params.id);
	const user = requireRole('customer');
	const view = await commissions.getForViewer(locals.db, { id: params.id, viewer: user, unit: user.units });
	if (!view || view.viewer !== 'owner')
		error(404, { message: 'There is no such commission to edit.', code: 'not_found' });
	const { issues, today, profileLabel } = await commissions.readiness(locals.db, { commission: step.commission });
	const c = step.commission;
	return {
		...step,
		view,
		issues,
		profileLabel,
		leadWarning: c.dateNeeded ? commissions.leadTimeWarning(c.garmentType, c.dateNeeded, today) : null
	};
};

export const actions: Actions = {
	publish: async ({ locals, params, getClientAddress }) => {
		const user = requireRole('customer');
		try {
			await commissions.publish(locals.db, {
				id: params.id,
				actor: { id: user.id, role: user.role, ip: getClientAddress() }
			});
		} catch (cause) {
			if (!(cause instanceof commissions.CommissionError)) throw cause;
			if (cause.code === 'not_found') error(404, { message: cause.message, code: 'not_found' });
			return fail(cause.code === 'wrong_status' ? 409 : 400, { errors: { form: [cause.message] } });
		}
		redirect(303, `/commissions/${params.id}?published=1`);
	}
};
