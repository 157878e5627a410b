import * as commissions from '$lib/server/commissions';
import * as places from '$lib/server/places';
import { placeFields, resolveFormPlace } from '$lib/server/places/form';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => ({
	...(await loadStep(locals, params.id)),
	countries: await places.countries(locals.db)
});

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'place',
			schema: placeFields.extend(commissions.schemas.handoverForm.shape),
			fields: ['place_query', 'place_country', 'handover'],
			toChanges: async ({ handover, ...fields }, db) => {
				const found = await resolveFormPlace(db, fields);
				if (!found.ok)
					throw new commissions.CommissionError('invalid', found.message, [{ path: 'place', message: found.message }]);
				const { name, country, lat, lng } = found.place;
				return { place: { lat, lng, city: name, district: null, countryCode: country }, handover };
			}
		})
};
