import * as commissions from '$lib/server/commissions';
import { loadStep, saveStep } from '../step.server';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const step = await loadStep(locals, params.id);
	const c = step.commission;
	const today = commissions.todayIn(await commissions.customerTimeZone(locals.db, c.customerId));
	return {
		...step,
		today,
		currencies: commissions.schemas.currencies,
		amounts: {
			budgetMin: commissions.schemas.amountForInput(c.budgetMinMinor, c.currency),
			budgetMax: commissions.schemas.amountForInput(c.budgetMaxMinor, c.currency)
		},
		leadWarning: c.dateNeeded ? commissions.leadTimeWarning(c.garmentType, c.dateNeeded, today) : null,
		typicalDays:
			commissions.typicalLeadDays[c.garmentType as keyof typeof commissions.typicalLeadDays] ??
			commissions.typicalLeadDays.other
	};
};

export const actions: Actions = {
	default: (event) =>
		saveStep(event, {
			step: 'budget',
			schema: commissions.schemas.budgetForm,
			fields: ['currency', 'budgetMin', 'budgetMax', 'dateNeeded'],
			toChanges: (form) => form
		})
};
