import * as commissions from '$lib/server/commissions';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = ({ locals, params }) => loadStep(locals, params.id);

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'fabric',
			schema: commissions.schemas.fabricForm,
			fields: ['fabricSource', 'fabricNotes'],
			toChanges: (form) => form
		})
};
