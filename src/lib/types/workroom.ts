import type { GarmentId } from '$lib/drafting';

/** The steps of a tailor's onboarding, in the order the workroom area shows them. */
export const onboardingSteps = [
	'name',
	'location',
	'capacity',
	'bio',
	'specialties',
	'lead_times',
	'rates',
	'portfolio'
] as const;
export type OnboardingStep = (typeof onboardingSteps)[number];

/** A step still to do; `garments` names the specialties a per-garment step still lacks. */
export type MissingStep = { step: OnboardingStep; garments?: GarmentId[] };

export type OnboardingStatus = { complete: boolean; missing: MissingStep[] };

export type WorkroomRates = {
	hourlyRateMinor: number;
	currency: string;
	/** Default labour hours per garment id. */
	labourHours: Partial<Record<GarmentId, number>>;
	fabricMarkupPercent: number;
};

/** The signed-in tailor's own workroom, exact place included. */
export type OwnWorkroom = {
	id: string;
	slug: string;
	name: string;
	bio: string;
	specialties: GarmentId[];
	location: { town: string; district: string | null; country: string | null; lat: number; lng: number };
	serviceRadiusKm: number;
	leadTimes: Partial<Record<GarmentId, number>>;
	capacity: number;
	rates: WorkroomRates | null;
	acceptingWork: boolean;
	onboardedAt: Date | null;
};

export type PortfolioPhoto = {
	id: string;
	url: string;
	thumbUrl: string;
	width: number;
	height: number;
	altText: string;
};
export type PortfolioItem = { id: string; caption: string; garmentType: string | null; photos: PortfolioPhoto[] };

/** What anyone may see of an onboarded workroom: the town, never the point on the map. */
export type PublicWorkroom = {
	id: string;
	slug: string;
	name: string;
	bio: string;
	specialties: { id: GarmentId; leadTimeDays: number | null }[];
	area: { town: string; district: string | null; country: string | null };
	serviceRadiusKm: number;
	acceptingWork: boolean;
	memberSince: Date;
	reviews: { count: number; averageHundredths: number | null };
	portfolio: PortfolioItem[];
};

export type DirectoryEntry = {
	id: string;
	slug: string;
	name: string;
	town: string;
	district: string | null;
	specialties: GarmentId[];
	acceptingWork: boolean;
	coverPhotoId: string | null;
	reviews: { count: number; averageHundredths: number | null };
};
