import type { OnboardingStep } from '$lib/types/workroom';

// Kept apart from `steps.ts`: the `setupSection` route matcher runs in every page's entry script, and the step
// descriptions there name garments (the whole garment catalogue), which the home page has no use for.

/** The setup pages, in order; each covers one or more onboarding steps. */
export const setupSections = [
	{ id: 'workroom', label: 'Name and place', steps: ['name', 'location', 'capacity'] },
	{ id: 'about', label: 'About your workroom', steps: ['bio'] },
	{ id: 'garments', label: 'Garments and lead times', steps: ['specialties', 'lead_times'] },
	{ id: 'rates', label: 'Rates', steps: ['rates'] }
] as const satisfies readonly { id: string; label: string; steps: readonly OnboardingStep[] }[];

export type SetupSection = (typeof setupSections)[number]['id'];
