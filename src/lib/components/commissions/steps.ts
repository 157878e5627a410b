/** The steps of the commission form, in order; each is a route under `/commissions/[id]/edit/`. */
export const commissionSteps = [
	{ id: 'garment', label: 'Garment' },
	{ id: 'photos', label: 'Photos' },
	{ id: 'measurements', label: 'Measurements' },
	{ id: 'fabric', label: 'Fabric' },
	{ id: 'budget', label: 'Budget and date' },
	{ id: 'place', label: 'Place' },
	{ id: 'review', label: 'Review' }
] as const;

export type CommissionStepId = (typeof commissionSteps)[number]['id'];

export function stepHref(commissionId: string, step: CommissionStepId) {
	return `/commissions/${commissionId}/edit/${step}`;
}

/** The step after `current`, or null on the last one. */
export function nextStep(current: CommissionStepId): CommissionStepId | null {
	const index = commissionSteps.findIndex((s) => s.id === current);
	return commissionSteps[index + 1]?.id ?? null;
}

export function previousStep(current: CommissionStepId): CommissionStepId | null {
	const index = commissionSteps.findIndex((s) => s.id === current);
	return index > 0 ? commissionSteps[index - 1].id : null;
}
