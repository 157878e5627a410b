import type { GarmentId } from '$lib/drafting';
import { onboardingSteps, type MissingStep, type OnboardingStatus } from '$lib/types/workroom';

/** The columns onboarding reads; `null` when the tailor has no workroom row yet. */
export type OnboardingFacts = {
	shopName: string;
	bio: string;
	specialties: GarmentId[];
	city: string;
	capacity: number;
	leadTimes: Partial<Record<string, number>>;
	hourlyRateMinor: number | null;
	rateCurrency: string | null;
	labourHours: Partial<Record<string, number>>;
};

function lacking(specialties: GarmentId[], values: Partial<Record<string, number>>) {
	return specialties.filter((garment) => !(typeof values[garment] === 'number' && values[garment] > 0));
}

/** Every step not yet done, in display order; an empty list means the workroom may quote. */
export function missingSteps(facts: OnboardingFacts | null, portfolioPhotos: number): MissingStep[] {
	if (!facts) return onboardingSteps.map((step) => ({ step }));
	const missing: MissingStep[] = [];
	const { specialties } = facts;
	if (!facts.shopName.trim()) missing.push({ step: 'name' });
	if (!facts.city.trim()) missing.push({ step: 'location' });
	if (!(facts.capacity > 0)) missing.push({ step: 'capacity' });
	if (!facts.bio.trim()) missing.push({ step: 'bio' });
	if (specialties.length === 0) missing.push({ step: 'specialties' });

	const withoutLeadTime = lacking(specialties, facts.leadTimes);
	if (specialties.length === 0) missing.push({ step: 'lead_times' });
	else if (withoutLeadTime.length) missing.push({ step: 'lead_times', garments: withoutLeadTime });

	const withoutHours = lacking(specialties, facts.labourHours);
	const rateSet = facts.hourlyRateMinor !== null && facts.hourlyRateMinor > 0 && facts.rateCurrency !== null;
	if (!rateSet || specialties.length === 0) missing.push({ step: 'rates' });
	else if (withoutHours.length) missing.push({ step: 'rates', garments: withoutHours });

	if (portfolioPhotos < 1) missing.push({ step: 'portfolio' });
	return missing;
}

export function statusOf(facts: OnboardingFacts | null, portfolioPhotos: number): OnboardingStatus {
	const missing = missingSteps(facts, portfolioPhotos);
	return { complete: missing.length === 0, missing };
}
