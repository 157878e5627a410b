import { fail, redirect } from '@sveltejs/kit';
import { currencyChoices } from '$lib/format/amount-input';
import { nextPath, type SetupSection } from '$lib/components/workrooms/steps';
import type { OwnWorkroom } from '$lib/types/workroom';
import { requireRole } from '$lib/server/auth/guard';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import { clientAddress } from '$lib/server/limits/handle';
import * as workrooms from '$lib/server/workrooms';
import * as places from '$lib/server/places';
import { placeFields, resolveFormPlace } from '$lib/server/places/form';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const tailor = requireRole('tailor');
	const [workroom, onboarding] = await Promise.all([
		workrooms.getOwn(locals.db, { tailorId: tailor.id }),
		workrooms.onboardingStatus(locals.db, { tailorId: tailor.id })
	]);
	return {
		section: params.section,
		workroom,
		onboarding,
		currencies: params.section === 'rates' ? currencyChoices() : [],
		countries: params.section === 'workroom' ? await places.countries(locals.db) : []
	};
};

/**
 * The place picker's fields as a place of the list (a typed name is matched without JavaScript). The saved
 * place comes back as its name only; sent back unchanged it stays as it is rather than being looked up again.
 */
async function readLocation(
	db: App.Locals['db'],
	form: FormData,
	current: OwnWorkroom | null
): Promise<{ ok: true; choice?: workrooms.LocationChoice } | { ok: false; errors: FieldErrors }> {
	const fields = parseForm(placeFields, form);
	if (!fields.ok)
		return {
			ok: false,
			errors: {
				place: Object.values(fields.errors)
					.flat()
					.filter((m) => m !== undefined)
			}
		};
	const saved = current?.location;
	if (
		saved &&
		!fields.data.place_id &&
		fields.data.place_query === (saved.district ?? saved.town) &&
		(!fields.data.place_country || fields.data.place_country === saved.country)
	) {
		return { ok: true };
	}
	const resolved = await resolveFormPlace(db, fields.data);
	if (!resolved.ok) return { ok: false, errors: { place: [resolved.message] } };
	const { id, lat, lng } = resolved.place;
	return { ok: true, choice: id === 'here' ? { lat, lng } : { placeId: id } };
}

type Parsed = { ok: true; input: workrooms.WorkroomInput } | { ok: false; errors: FieldErrors };

async function parseSection(
	section: SetupSection,
	form: FormData,
	current: OwnWorkroom | null,
	db: App.Locals['db']
): Promise<Parsed> {
	switch (section) {
		case 'workroom': {
			const basics = parseForm(workrooms.basicsForm, form);
			const location = await readLocation(db, form, current);
			if (!basics.ok || !location.ok) {
				return { ok: false, errors: { ...(basics.ok ? {} : basics.errors), ...(location.ok ? {} : location.errors) } };
			}
			return { ok: true, input: location.choice ? { ...basics.data, location: location.choice } : basics.data };
		}
		case 'about': {
			const about = parseForm(workrooms.aboutForm, form);
			return about.ok ? { ok: true, input: about.data } : about;
		}
		case 'garments': {
			const garments = parseForm(workrooms.garmentsForm, form);
			return garments.ok ? { ok: true, input: garments.data } : garments;
		}
		case 'rates': {
			const rates = parseForm(workrooms.ratesForm(current?.specialties ?? []), form);
			return rates.ok ? { ok: true, input: rates.data } : rates;
		}
	}
}

export const actions: Actions = {
	default: async (event) => {
		const tailor = requireRole('tailor');
		const { locals, params } = event;
		const section = params.section;
		const form = await readForm(event.request);
		if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
		const values = keepValues(form.data, [...new Set(form.data.keys())]);

		const current = await workrooms.getOwn(locals.db, { tailorId: tailor.id });
		if (section === 'rates' && !current?.specialties.length) {
			return fail(400, {
				values,
				errors: { form: ['Choose the garments you make first; rates are asked per garment.'] }
			});
		}
		const parsed = await parseSection(section, form.data, current, locals.db);
		if (!parsed.ok) return fail(400, { values, errors: parsed.errors });
		let saved;
		try {
			saved = await workrooms.save(locals.db, { tailorId: tailor.id, input: parsed.input, ip: clientAddress(event) });
		} catch (error) {
			if (error instanceof workrooms.UnknownPlace) return fail(400, { values, errors: { place: [error.message] } });
			if (!(error instanceof workrooms.WorkroomNotStarted)) throw error;
			return fail(409, { values, errors: { form: [error.message] } });
		}
		redirect(303, nextPath(section, saved.onboarding.missing));
	}
};
