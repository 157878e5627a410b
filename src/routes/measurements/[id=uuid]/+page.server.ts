import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { formValue, readForm } from '$lib/server/forms';
import { clientAddress } from '$lib/server/limits/handle';
import * as profiles from '$lib/server/profiles';
import { readProfileForm } from '$lib/server/profiles/form';
import { garmentFrom, storedValues } from '../form-values';
import { backWith, returnTarget } from '../return-target.server';
import type { Actions, PageServerLoad } from './$types';

function notFound(): never {
	error(404, { message: 'There is no measurement profile at this address in your account.' });
}

export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = requireRole('customer');
	const profile = await profiles.get(locals.db, { ownerId: user.id, id: params.id });
	if (!profile) notFound();
	const garment = garmentFrom(url);
	return {
		id: profile.id,
		label: profile.label,
		stored: storedValues({ ...profile, takenAt: profiles.dayOf(profile.takenAt) }),
		returnTo: returnTarget(url.searchParams.get('return')),
		required: garment ? profiles.neededFor(garment) : [],
		saved: url.searchParams.has('saved')
	};
};

export const actions: Actions = {
	save: async (event) => {
		const user = requireRole('customer');
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { action: 'save' as const, values: form.values, errors: form.errors });
		const read = readProfileForm(form.data);
		if (!read.ok) return fail(400, { action: 'save' as const, values: read.values, errors: read.errors });
		let saved;
		try {
			saved = await profiles.update(event.locals.db, {
				ownerId: user.id,
				id: event.params.id,
				ip: clientAddress(event),
				changes: read.fields
			});
		} catch (cause) {
			if (!(cause instanceof profiles.DuplicateLabel)) throw cause;
			return fail(409, { action: 'save' as const, values: read.values, errors: { label: [cause.message] } });
		}
		if (!saved) notFound();
		const back = returnTarget(formValue(form.data, 'return'));
		redirect(303, back ? backWith(back, event.params.id) : `/measurements/${event.params.id}?saved=1`);
	},

	delete: async (event) => {
		const user = requireRole('customer');
		const removed = await profiles.remove(event.locals.db, {
			ownerId: user.id,
			id: event.params.id,
			ip: clientAddress(event)
		});
		if (!removed) notFound();
		redirect(303, '/measurements?deleted=1');
	}
};
