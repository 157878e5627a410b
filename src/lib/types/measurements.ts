import type { Unit } from '$lib/drafting';

/** What the profile form shows: as stored, or as typed when a submit comes back. */
export type ProfileFormValues = {
	label: string;
	unit: Unit;
	takenBy: string;
	takenAt: string;
	notes: string;
	/** Typed lengths by measurement code. */
	texts: Record<string, string>;
};
