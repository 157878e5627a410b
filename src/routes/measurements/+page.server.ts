import { fail } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import { clientAddress } from '$lib/server/limits/handle';
import * as profiles from '$lib/server/profiles';
import { deleteForm, renameForm } from '$lib/server/profiles/schemas';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('customer');
	const list = await profiles.list(locals.db, { ownerId: user.id });
	return {
		profiles: list.map((p) => ({
			id: p.id,
			label: p.label,
			unit: p.unit,
			count: Object.keys(p.valuesMm).length,
			toCheck: profiles.checksFor(p).errors.length,
			takenBy: p.takenBy,
			takenAt: profiles.dayOf(p.takenAt),
			updatedAt: p.updatedAt.toISOString()
		})),
		deleted: url.searchParams.get('deleted')
	};
};

export const actions: Actions = {
	rename: async (event) => {
		const user = requireRole('customer');
		const form = await readForm(event.request);
		if (!form.ok) return failed(form.status, 'rename', form.values, form.errors);
		const values = keepValues(form.data, ['id', 'label']);
		const parsed = parseForm(renameForm, form.data);
		if (!parsed.ok) return failed(400, 'rename', values, parsed.errors);
		try {
			const renamed = await profiles.update(event.locals.db, {
				ownerId: user.id,
				id: parsed.data.id,
				ip: clientAddress(event),
				changes: { label: parsed.data.label }
			});
			if (!renamed) return failed(404, 'rename', values, { form: [gone] });
		} catch (cause) {
			if (!(cause instanceof profiles.DuplicateLabel)) throw cause;
			return failed(409, 'rename', values, { label: [cause.message] });
		}
		return { action: 'rename' as const, renamed: parsed.data.id };
	},

	delete: async (event) => {
		const user = requireRole('customer');
		const form = await readForm(event.request);
		if (!form.ok) return failed(form.status, 'delete', form.values, form.errors);
		const parsed = parseForm(deleteForm, form.data);
		if (!parsed.ok) return failed(400, 'delete', {}, parsed.errors);
		const removed = await profiles.remove(event.locals.db, {
			ownerId: user.id,
			id: parsed.data.id,
			ip: clientAddress(event)
		});
		if (!removed) return failed(404, 'delete', {}, { form: [gone] });
		return { action: 'delete' as const, deleted: true };
	}
};

const gone = 'That profile is no longer in your account.';

function failed(status: number, action: 'rename' | 'delete', values: Record<string, string>, errors: FieldErrors) {
	return fail(status, { action, values, errors });
}
