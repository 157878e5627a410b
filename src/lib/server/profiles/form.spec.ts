import { describe, expect, it } from 'vitest';
import { readProfileForm } from './form';

function form(fields: Record<string, string>) {
	const data = new FormData();
	for (const [key, value] of Object.entries({
		label: 'Me',
		unit: 'in',
		takenBy: 'self',
		takenAt: '',
		notes: '',
		...fields
	}))
		data.append(key, value);
	return data;
}

describe('readProfileForm', () => {
	it('reads eighths, vulgar fractions, decimals and a unit suffix into millimetres', () => {
		const read = readProfileForm(
			form({ 'm.hip_girth': '40 3/8', 'm.waist_girth': '30⅛', 'm.waist_to_hip': '8.25', 'm.stature': '165 cm' })
		);
		expect(read.ok).toBe(true);
		if (!read.ok) return;
		// 1 in = 25.4 mm exactly; 40.375 in = 1025.525 mm, 30.125 in = 765.175 mm, 8.25 in = 209.55 mm.
		expect(read.fields.valuesMm.hip_girth).toBeCloseTo(1025.525, 9);
		expect(read.fields.valuesMm.waist_girth).toBeCloseTo(765.175, 9);
		expect(read.fields.valuesMm.waist_to_hip).toBeCloseTo(209.55, 9);
		expect(read.fields.valuesMm.stature).toBeCloseTo(1650, 9);
		expect(read.fields.takenAt).toBeNull();
	});

	it('names each unreadable or impossible field and keeps what was typed', () => {
		const read = readProfileForm(form({ 'm.hip_girth': 'forty', 'm.waist_girth': '0' }));
		expect(read.ok).toBe(false);
		if (read.ok) return;
		expect(Object.keys(read.errors).sort()).toEqual(['m.hip_girth', 'm.waist_girth']);
		expect(read.values['m.hip_girth']).toBe('forty');
	});

	it('holds back a suspected unit mix-up until the person ticks that the numbers are right', () => {
		// A 100 cm hip typed into an inch field: 2540 mm, which reads as centimetres.
		const held = readProfileForm(form({ 'm.hip_girth': '100' }));
		expect(held.ok).toBe(false);
		if (held.ok) return;
		expect(held.checks?.errors.map((f) => f.code)).toEqual(['unit_mixup']);
		expect(held.errors.form?.[0]).toMatch(/tick/);
		expect(readProfileForm(form({ 'm.hip_girth': '100', confirmed: 'yes' })).ok).toBe(true);
	});

	it('saves out-of-range values that are only unusual, without asking', () => {
		expect(readProfileForm(form({ unit: 'cm', 'm.hip_girth': '160' })).ok).toBe(true);
	});
});
