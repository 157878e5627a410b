import * as commissions from '$lib/server/commissions';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => loadStep(locals, params.id);

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'garment',
			schema: commissions.schemas.garmentForm,
			fields: ['garment', 'garmentOther', 'title', 'styleNotes'],
			toChanges: (form) => ({
				garmentType: form.garment,
				garmentOther: form.garment === 'other' ? form.garmentOther : '',
				title: form.title,
				styleNotes: form.styleNotes
			})
		})
};
