import type { SizeBandRange } from '$lib/format/size-band';

/** One open commission in a tailor's near-me list, as the API answers it and the page shows it. */
export type NearbyCommissionItem = {
	id: string;
	title: string;
	garment: string;
	garmentOther: string;
	sizeBand: SizeBandRange[];
	sizeBandText: string | null;
	budget: { minMinor: number; maxMinor: number; currency: string } | null;
	dateNeeded: string | null;
	fabricSource: 'customer_supplies' | 'tailor_sources';
	handover: 'pickup' | 'delivery';
	town: string | null;
	district: string | null;
	publishedAt: string | null;
	photo: { thumbUrl: string; altText: string } | null;
	distanceKm: number;
};

/** One workroom in a customer's near-me list. */
export type NearbyWorkroomItem = {
	id: string;
	slug: string;
	name: string;
	town: string;
	district: string | null;
	specialties: string[];
	serviceRadiusKm: number;
	servesYou: boolean;
	coverThumbUrl: string | null;
	reviews: { count: number; averageHundredths: number | null };
	distanceKm: number;
};

export type NearbyPage<T> = { items: T[]; nextCursor: string | null };
