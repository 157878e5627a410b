import type { OwnWorkroom } from '$lib/types/workroom';

/** What each section form receives: the saved workroom, and what was typed when a save failed. */
export type SectionProps = {
	workroom: OwnWorkroom | null;
	values: Partial<Record<string, string>>;
	errors: Partial<Record<string, string[]>>;
};
