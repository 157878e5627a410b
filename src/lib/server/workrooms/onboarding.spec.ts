import { describe, expect, it } from 'vitest';
import { onboardingSteps } from '$lib/types/workroom';
import { missingSteps, statusOf, type OnboardingFacts } from './onboarding';

const complete: OnboardingFacts = {
	shopName: 'Gull Yard Tailoring',
	bio: 'Trousers and skirts cut to your measurements, fitted twice.',
	specialties: ['straight-skirt', 'wide-leg-trousers'],
	city: 'Merrowgate',
	capacity: 3,
	leadTimes: { 'straight-skirt': 10, 'wide-leg-trousers': 14 },
	hourlyRateMinor: 3500,
	rateCurrency: 'EUR',
	labourHours: { 'straight-skirt': 5, 'wide-leg-trousers': 8 }
};

const steps = (facts: OnboardingFacts | null, photos = 1) => missingSteps(facts, photos).map((m) => m.step);

describe('onboarding', () => {
	it('is complete when every step is done and one portfolio photo exists', () => {
		expect(statusOf(complete, 1)).toEqual({ complete: true, missing: [] });
	});

	it('lists every step, in order, before the workroom exists', () => {
		expect(steps(null, 0)).toEqual([...onboardingSteps]);
		expect(statusOf(null, 0).complete).toBe(false);
	});

	it('asks for a portfolio photo', () => {
		expect(steps(complete, 0)).toEqual(['portfolio']);
	});

	it('treats a blank name or description as missing', () => {
		expect(steps({ ...complete, bio: '   ' })).toEqual(['bio']);
		expect(steps({ ...complete, shopName: '' })).toEqual(['name']);
	});

	it('names the specialties that still lack a lead time or labour hours', () => {
		const facts = {
			...complete,
			specialties: [...complete.specialties, 'tunic' as const],
			leadTimes: { ...complete.leadTimes, tunic: 0 }
		};
		expect(missingSteps(facts, 1)).toEqual([
			{ step: 'lead_times', garments: ['tunic'] },
			{ step: 'rates', garments: ['tunic'] }
		]);
	});

	it('cannot count lead times or rates done without a specialty', () => {
		expect(steps({ ...complete, specialties: [] })).toEqual(['specialties', 'lead_times', 'rates']);
	});

	it('needs an hourly rate and its currency', () => {
		expect(steps({ ...complete, hourlyRateMinor: null })).toEqual(['rates']);
		expect(steps({ ...complete, rateCurrency: null })).toEqual(['rates']);
	});
});
