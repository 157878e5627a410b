import { fail, redirect } from '@sveltejs/kit';
import { stepHref } from '$lib/components/commissions/steps';
import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { keepValues, parseForm, readForm } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = () => {
	requireRole('customer');
	return {};
};

const fields = ['garment', 'garmentOther', 'title', 'styleNotes'];

export const actions: Actions = {
	default: async ({ request, locals, getClientAddress }) => {
		const user = requireRole('customer');
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
		const values = keepValues(form.data, fields);
		const parsed = parseForm(commissions.schemas.garmentForm, form.data);
		if (!parsed.ok) return fail(400, { values, errors: parsed.errors });
		const { garment, garmentOther, title, styleNotes } = parsed.data;
		const draft = await commissions.createDraft(locals.db, {
			actor: { id: user.id, role: user.role, ip: getClientAddress() },
			changes: { garmentType: garment, garmentOther: garment === 'other' ? garmentOther : '', title, styleNotes }
		});
		redirect(303, form.data.get('then') === 'later' ? '/commissions?saved=1' : stepHref(draft.id, 'photos'));
	}
};
