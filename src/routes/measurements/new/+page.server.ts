import { fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { formValue, readForm } from '$lib/server/forms';
import { clientAddress } from '$lib/server/limits/handle';
import * as profiles from '$lib/server/profiles';
import { readProfileForm } from '$lib/server/profiles/form';
import { garmentFrom } from '../form-values';
import { backWith, returnTarget } from '../return-target.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ url }) => {
	const user = requireRole('customer');
	const garment = garmentFrom(url);
	return {
		unit: user.units,
		returnTo: returnTarget(url.searchParams.get('return')),
		required: garment ? profiles.neededFor(garment) : []
	};
};

export const actions: Actions = {
	default: async (event) => {
		const user = requireRole('customer');
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
		const read = readProfileForm(form.data);
		if (!read.ok) return fail(400, { values: read.values, errors: read.errors });
		let id: string;
		try {
			({ id } = await profiles.create(event.locals.db, {
				ownerId: user.id,
				ip: clientAddress(event),
				fields: read.fields
			}));
		} catch (cause) {
			if (!(cause instanceof profiles.DuplicateLabel)) throw cause;
			return fail(409, { values: read.values, errors: { label: [cause.message] } });
		}
		const back = returnTarget(formValue(form.data, 'return'));
		redirect(303, back ? backWith(back, id) : `/measurements/${id}?saved=1`);
	}
};
