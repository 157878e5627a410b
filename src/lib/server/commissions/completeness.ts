import { garments, measurementInfo, type MeasurementCode } from '$lib/drafting';
import type { Commission } from '../db/schema';
import type { CommissionIssue } from './errors';

export type StepId = 'garment' | 'measurements' | 'fabric' | 'budget' | 'place' | 'review';

/** Where in the form each publish problem is mended. */
export const stepOfField: Record<string, StepId> = {
	garment: 'garment',
	garmentOther: 'garment',
	title: 'garment',
	measurementProfileId: 'measurements',
	measurements: 'measurements',
	fabricSource: 'fabric',
	budget: 'budget',
	dateNeeded: 'budget',
	location: 'place',
	handover: 'place'
};

/** The measurements the garment needs that the profile lacks (none for "other"). */
export function missingMeasurements(garmentType: string, valuesMm: Record<string, number>): MeasurementCode[] {
	const garment = garments.find((g) => g.id === garmentType);
	return (garment?.requiredMeasurements ?? []).filter((code) => valuesMm[code] === undefined);
}

type Row = Pick<
	Commission,
	| 'garmentType'
	| 'garmentOther'
	| 'title'
	| 'measurementProfileId'
	| 'budgetMinMinor'
	| 'budgetMaxMinor'
	| 'currency'
	| 'dateNeeded'
	| 'approxLat'
	| 'approxLng'
	| 'city'
>;

/** Everything publishing needs that the draft does not have yet; empty when it may be published. */
export function missingForPublish(
	row: Row,
	profile: { valuesMm: Record<string, number> } | null,
	today: string
): CommissionIssue[] {
	const issues: CommissionIssue[] = [];
	const known = row.garmentType === 'other' || garments.some((g) => g.id === row.garmentType);
	if (!known) issues.push({ path: 'garment', message: 'Choose the garment.' });
	if (row.garmentType === 'other' && !row.garmentOther)
		issues.push({ path: 'garmentOther', message: 'Say what garment you would like.' });
	if (row.title.trim().length < 3) issues.push({ path: 'title', message: 'Give the commission a title.' });
	if (!profile) issues.push({ path: 'measurementProfileId', message: 'Choose a measurement profile.' });
	else {
		const lacking = missingMeasurements(row.garmentType, profile.valuesMm);
		if (lacking.length)
			issues.push({
				path: 'measurements',
				message: `The profile lacks measurements this garment needs: ${lacking.map((code) => measurementInfo[code].label.toLowerCase()).join(', ')}.`
			});
	}
	if (row.budgetMinMinor === null || row.budgetMaxMinor === null)
		issues.push({ path: 'budget', message: 'Give your budget.' });
	if (!row.dateNeeded) issues.push({ path: 'dateNeeded', message: 'Give the date you need it by.' });
	else if (row.dateNeeded <= today)
		issues.push({ path: 'dateNeeded', message: 'The date needed has passed; choose a later one.' });
	if (row.approxLat === null || row.approxLng === null || !row.city)
		issues.push({ path: 'location', message: 'Choose your town.' });
	return issues;
}
