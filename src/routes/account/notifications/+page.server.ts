import { fail } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { parseForm, readForm } from '$lib/server/forms';
import * as notifications from '$lib/server/notifications';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	const user = requireUser();
	return { groups: await notifications.preferences.grouped(locals.db, { userId: user.id, role: user.role }) };
};

export const actions: Actions = {
	/** The whole grid: a ticked box is on, an unticked one off; events that are always sent stay on. */
	save: async ({ request, locals }) => {
		const user = requireUser();
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { errors: form.errors });
		const parsed = parseForm(notifications.schemas.preferencesForm(user.role), form.data);
		if (!parsed.ok) return fail(400, { errors: parsed.errors });
		await notifications.preferences.save(locals.db, {
			userId: user.id,
			role: user.role,
			changes: notifications.schemas.changesFromForm(user.role, parsed.data)
		});
		return { saved: true };
	}
};
