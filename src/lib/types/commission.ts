import type { SizeBandRange } from '$lib/format/size-band';

/** What a commission page shows; the server fills it according to who is looking. */
export type CommissionDetail = {
	id: string;
	status: 'draft' | 'open' | 'awarded' | 'closed' | 'cancelled' | 'expired';
	garment: string;
	garmentOther: string;
	title: string;
	styleNotes: string;
	fabricSource: 'customer_supplies' | 'tailor_sources';
	fabricNotes: string;
	budget: { minMinor: number; maxMinor: number; currency: string } | null;
	dateNeeded: string | null;
	handover: 'pickup' | 'delivery';
	sizeBand: SizeBandRange[];
	sizeBandText: string | null;
	location: { name: string | null; district: string | null; country: string | null } | null;
	customer: { name: string | null };
	publishedAt: Date | null;
	expiresAt: Date | null;
	photos: { id: string; altText: string; width: number; height: number }[] | null;
};
