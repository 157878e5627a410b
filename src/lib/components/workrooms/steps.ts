import { garmentName } from '$lib/format';
import type { MissingStep, OnboardingStep } from '$lib/types/workroom';
import { setupSections, type SetupSection } from './sections';

export { setupSections, type SetupSection } from './sections';

export const portfolioPath = '/workroom/portfolio';

const stepLabels: Record<OnboardingStep, string> = {
	name: 'Your workroom’s name',
	location: 'Where your workroom is, and how far you serve',
	capacity: 'How many orders you take on at once',
	bio: 'A few words about your workroom',
	specialties: 'The garments you make',
	lead_times: 'A typical lead time for each garment',
	rates: 'Your hourly rate, labour hours per garment and fabric mark-up',
	portfolio: 'At least one portfolio photo'
};

export function sectionOf(step: OnboardingStep): SetupSection | 'portfolio' {
	return setupSections.find((section) => (section.steps as readonly string[]).includes(step))?.id ?? 'portfolio';
}

export function stepHref(step: OnboardingStep) {
	const section = sectionOf(step);
	return section === 'portfolio' ? portfolioPath : `/workroom/setup/${section}`;
}

/** "A typical lead time for each garment: still needed for Tunic". */
export function describeMissing(missing: MissingStep) {
	const label = stepLabels[missing.step];
	if (!missing.garments?.length) return label;
	return `${label} — still needed for ${missing.garments.map(garmentName).join(', ')}`;
}

export function stepLabel(step: OnboardingStep) {
	return stepLabels[step];
}

/** Where "Save and continue" leads: the next section with something missing, else back to the workroom. */
export function nextPath(current: SetupSection, missing: MissingStep[]) {
	const order = [...setupSections.map((s) => s.id), 'portfolio'];
	const sections = missing.map((m) => sectionOf(m.step));
	const after = sections.find((s) => order.indexOf(s) > order.indexOf(current)) ?? sections[0];
	if (!after) return '/workroom?saved=1';
	return after === 'portfolio' ? portfolioPath : `/workroom/setup/${after}`;
}
