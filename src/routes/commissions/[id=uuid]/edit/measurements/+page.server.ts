import * as commissions from '$lib/server/commissions';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const step = await loadStep(locals, params.id);
	const profiles = await commissions.profilesOf(locals.db, { ownerId: step.commission.customerId });
	const withGaps = profiles.map((p) => ({
		id: p.id,
		label: p.label,
		missing: commissions.missingMeasurements(
			step.commission.garmentType,
			Object.fromEntries(p.codes.map((code) => [code, 1]))
		)
	}));
	return { ...step, profiles: withGaps };
};

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'measurements',
			schema: commissions.schemas.measurementsForm,
			fields: ['measurementProfileId'],
			toChanges: (form) => ({ measurementProfileId: form.measurementProfileId })
		})
};
