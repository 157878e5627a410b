import { describe, expect, it } from 'vitest';
import { parseForm } from '../forms';
import { basicsForm, garmentsForm, ratesForm, workroomReplace } from './schemas';

function form(fields: Record<string, string>) {
	const data = new FormData();
	for (const [key, value] of Object.entries(fields)) data.append(key, value);
	return data;
}

describe('garments form', () => {
	it('reads ticked garments with their lead times and ignores the rest', () => {
		const parsed = parseForm(
			garmentsForm,
			form({
				make_tunic: 'on',
				lead_tunic: '9',
				'lead_shift-dress': '30',
				'make_straight-skirt': 'on',
				'lead_straight-skirt': ' 12 '
			})
		);
		expect(parsed).toEqual({
			ok: true,
			data: { specialties: ['straight-skirt', 'tunic'], leadTimes: { 'straight-skirt': 12, tunic: 9 } }
		});
	});

	it('puts each problem beside its field', () => {
		const none = parseForm(garmentsForm, form({}));
		expect(none.ok || none.errors.specialties).toEqual(['Choose at least one garment you make.']);
		const bad = parseForm(garmentsForm, form({ make_tunic: 'on', lead_tunic: '2.5', 'make_a-line-skirt': 'on' }));
		expect(bad.ok).toBe(false);
		if (!bad.ok) {
			expect(bad.errors.lead_tunic).toEqual(['Give a lead time from 1 to 365 days.']);
			expect(bad.errors['lead_a-line-skirt']).toEqual(['Give a typical lead time in days.']);
		}
	});
});

describe('rates form', () => {
	it('turns the typed rate into minor units of the chosen currency and asks hours per specialty', () => {
		const parsed = parseForm(
			ratesForm(['tunic']),
			form({ hourlyRate: '4200', currency: 'jpy', fabricMarkupPercent: '5', hours_tunic: '3.25' })
		);
		expect(parsed).toEqual({
			ok: true,
			data: { rates: { hourlyRateMinor: 4200, currency: 'JPY', labourHours: { tunic: 3.25 }, fabricMarkupPercent: 5 } }
		});
	});

	it('refuses hours that are not quarters, a missing rate and a made-up currency', () => {
		const bad = parseForm(
			ratesForm(['tunic']),
			form({ hourlyRate: '', currency: 'EUR', fabricMarkupPercent: '0', hours_tunic: '3.1' })
		);
		expect(bad.ok).toBe(false);
		if (!bad.ok) {
			expect(bad.errors.hourlyRate).toEqual(['Give your hourly rate.']);
			expect(bad.errors.hours_tunic).toEqual(['Give hours in quarters of an hour (2, 2.25, 2.5…).']);
		}
		const currency = parseForm(ratesForm([]), form({ hourlyRate: '30', currency: 'ABC', fabricMarkupPercent: '0' }));
		expect(currency.ok || currency.errors.currency).toEqual(['Choose a currency.']);
	});
});

describe('workroom basics form', () => {
	it('needs a name, a distance and a capacity in range', () => {
		const bad = parseForm(basicsForm, form({ name: 'A', serviceRadiusKm: 'far', capacity: '0' }));
		expect(bad.ok).toBe(false);
		if (!bad.ok) {
			expect(bad.errors.name).toEqual(['Give your workroom a name of at least 2 characters.']);
			expect(bad.errors.serviceRadiusKm).toEqual(['Enter a number.']);
			expect(bad.errors.capacity).toEqual(['Say how many orders at once, from 1 to 50.']);
		}
	});
});

describe('PUT body', () => {
	const minimal = {
		name: 'Weir Street Workroom',
		location: { placeId: 'geonames:2988507' },
		serviceRadiusKm: 5,
		capacity: 2
	};

	it('fills what a full replace leaves out with empty values', () => {
		expect(workroomReplace.parse(minimal)).toEqual({
			...minimal,
			bio: '',
			specialties: [],
			leadTimes: {},
			rates: null
		});
	});

	it('takes a point instead of a place id, and refuses unknown keys', () => {
		expect(workroomReplace.safeParse({ ...minimal, location: { lat: 46.85, lng: 3.21 } }).success).toBe(true);
		expect(workroomReplace.safeParse({ ...minimal, location: { placeId: 'paris' } }).success).toBe(false);
		expect(workroomReplace.safeParse({ ...minimal, slug: 'mine' }).success).toBe(false);
	});
});
