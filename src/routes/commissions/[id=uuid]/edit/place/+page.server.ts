import * as commissions from '$lib/server/commissions';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => loadStep(locals, params.id);

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'place',
			schema: commissions.schemas.placeForm,
			fields: ['place_name', 'place_country', 'place_lat', 'place_lng', 'handover'],
			toChanges: (form) => ({
				place: {
					lat: form.place_lat,
					lng: form.place_lng,
					city: form.place_name,
					district: null,
					countryCode: form.place_country
				},
				handover: form.handover
			})
		})
};
