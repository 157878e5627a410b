import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { checkMeasurements, checkMissing, checkRelations, checkValue } from './checks';
import { measurementCodes, measurementInfo } from './measurements';

const inch = 25.4;

describe('checkValue', () => {
	it('accepts the ANSUR II median woman', () => {
		// ANSUR II (2012) female p50: stature 1626 mm, chest 940, waist 852, buttock (hip) 1018, thigh 613.
		expect(checkValue('stature', 1626, 'cm')).toBeNull();
		expect(checkValue('bust_girth', 940, 'cm')).toBeNull();
		expect(checkValue('waist_girth', 852, 'cm')).toBeNull();
		expect(checkValue('hip_girth', 1018, 'cm')).toBeNull();
		expect(checkValue('thigh_girth', 613, 'cm')).toBeNull();
	});

	it('accepts the EN 13402-3 pictogram body 88-72-96 cm', () => {
		expect(checkValue('bust_girth', 880, 'cm')).toBeNull();
		expect(checkValue('waist_girth', 720, 'cm')).toBeNull();
		expect(checkValue('hip_girth', 960, 'cm')).toBeNull();
	});

	it('warns outside the range and names the range in the person’s unit', () => {
		// NHANES 2017–2020 female hip p99 is 154.6 cm; 160 cm is unusual but real.
		const finding = checkValue('hip_girth', 1600, 'cm');
		expect(finding?.code).toBe('out_of_range');
		expect(finding?.message).toContain('83–154.6 cm');
	});

	it('spots centimetres typed into an inch field', () => {
		const finding = checkValue('hip_girth', 100 * inch, 'in'); // someone typed their 100 cm hip as "100" inches
		expect(finding?.code).toBe('unit_mixup');
		expect(finding?.message).toContain('centimetres typed into an inch field');
	});

	it('spots inches typed into a centimetre field', () => {
		const finding = checkValue('waist_girth', 300, 'cm'); // "30" meaning 30 in
		expect(finding?.code).toBe('unit_mixup');
		expect(finding?.message).toContain('inches typed into a centimetre field');
	});

	it('spots millimetres typed as centimetres (10× off)', () => {
		const finding = checkValue('bust_girth', 9200, 'cm'); // "920" meaning 920 mm
		expect(finding?.code).toBe('unit_mixup');
		expect(finding?.message).toContain('millimetres');
	});

	it('calls a wild value a likely typo when no unit explains it', () => {
		expect(checkValue('thigh_girth', 50, 'cm')?.code).toBe('likely_typo');
	});

	it('refuses zero', () => {
		expect(checkValue('hip_girth', 0, 'cm')?.code).toBe('not_positive');
	});

	it('never flags a value inside the typical range (property)', () => {
		fc.assert(
			fc.property(fc.constantFrom(...measurementCodes), fc.double({ min: 0, max: 1, noNaN: true }), (code, t) => {
				const [low, high] = measurementInfo[code].typical;
				expect(checkValue(code, low + t * (high - low), 'in')).toBeNull();
			})
		);
	});

	it('keeps each typical range narrower than a 2.54× unit slip, so a mix-up is never ambiguous', () => {
		for (const code of measurementCodes) {
			const [low, high] = measurementInfo[code].typical;
			const [floor, ceiling] = measurementInfo[code].limits;
			expect(high / low, code).toBeLessThan(2.54);
			expect(floor, code).toBeLessThan(low);
			expect(ceiling, code).toBeGreaterThan(high);
		}
	});
});

describe('checkRelations', () => {
	it('makes inside leg ≥ waist to floor an error (inside leg ends at the crotch, below the waist)', () => {
		const { errors } = checkRelations({ inside_leg: 1000, waist_to_floor: 980 }, 'cm');
		expect(errors).toHaveLength(1);
		expect(errors[0].code).toBe('impossible_relation');
		expect(errors[0].fields).toEqual(['inside_leg', 'waist_to_floor']);
	});

	it('makes under bust above bust an error (EN 13402-1: bust is the fullest chest girth)', () => {
		expect(checkRelations({ under_bust_girth: 950, bust_girth: 900 }, 'cm').errors[0].fields).toContain('bust_girth');
	});

	it('warns about an unusual waist-to-hip ratio', () => {
		// ANSUR II (2012) waist/hip p5–p95 spans 0.749 (women) to 1.020 (men); 0.55 is well outside.
		const { warnings, errors } = checkRelations({ waist_girth: 550, hip_girth: 1000 }, 'cm');
		expect(errors).toHaveLength(0);
		expect(warnings[0].code).toBe('unusual_relation');
	});

	it('warns when body rise strays from outside leg − inside leg (tailoring practice)', () => {
		const { warnings } = checkRelations({ body_rise: 400, waist_to_floor: 1050, inside_leg: 780 }, 'cm');
		expect(warnings.map((w) => w.fields)).toContainEqual(['body_rise', 'waist_to_floor', 'inside_leg']);
	});

	it('is quiet for a consistent body (ANSUR II female medians)', () => {
		const result = checkRelations(
			{ stature: 1626, waist_to_floor: 978, inside_leg: 780, body_rise: 198, waist_girth: 852, hip_girth: 1018 },
			'cm'
		);
		expect(result).toEqual({ warnings: [], errors: [] });
	});
});

describe('checkMissing and checkMeasurements', () => {
	it('lists the missing measurements by name', () => {
		const finding = checkMissing({ hip_girth: 1000 }, ['hip_girth', 'waist_girth', 'thigh_girth']);
		expect(finding?.fields).toEqual(['waist_girth', 'thigh_girth']);
		expect(finding?.message).toContain('Waist, Thigh');
	});

	it('puts value warnings, missing errors and relation errors together', () => {
		const result = checkMeasurements({ hip_girth: 1600, inside_leg: 1000, waist_to_floor: 900 }, 'cm', [
			'hip_girth',
			'waist_girth'
		]);
		expect(result.warnings.map((w) => w.code)).toContain('out_of_range');
		expect(result.errors.map((e) => e.code).sort()).toEqual(['impossible_relation', 'missing_measurements']);
	});
});

describe('checkMeasurements — values that stop a draft', () => {
	it('stops on a hip no body has (99 999 cm; ANSUR II and NHANES 2017–2020 maxima are under 2 m)', () => {
		const { errors } = checkMeasurements({ hip_girth: 999_990, waist_girth: 720 }, 'cm');
		expect(errors.map((e) => [e.code, e.fields])).toEqual([['likely_typo', ['hip_girth']]]);
	});

	it('stops on inches typed into a cm form until the unit is answered, and offers inches', () => {
		// The EN 13402-3 body 88-72-96 cm typed in inches: 38, 28 ¼, 8 (waist to hip 20.6 cm).
		const body = { hip_girth: 380, waist_girth: 283, waist_to_hip: 80 };
		const stopped = checkMeasurements(body, 'cm');
		expect(stopped.errors.map((e) => e.code)).toEqual(['unit_mixup', 'unit_mixup', 'unit_mixup']);
		expect(stopped.errors.every((e) => e.suggestedUnit === 'in')).toBe(true);
		const confirmed = checkMeasurements(body, 'cm', [], { unitConfirmed: true });
		expect(confirmed.errors).toEqual([]);
		expect(confirmed.warnings.map((w) => w.code)).toContain('unit_mixup');
	});

	it('reads a child’s small waist as a child’s when the height says child, with no unit mix-up', () => {
		// WHO growth standards: a five-year-old is about 110 cm tall; a waist of about 52 cm is usual at that age
		// (from memory). 52 cm would be 132 cm had it been inches — an adult waist — so only the height tells.
		const { errors, warnings } = checkMeasurements({ stature: 1100, waist_girth: 520, hip_girth: 580 }, 'cm');
		expect(errors).toEqual([]);
		expect(warnings.map((w) => w.code)).not.toContain('unit_mixup');
		expect(checkMeasurements({ waist_girth: 520 }, 'cm').errors.map((e) => e.code)).toEqual(['unit_mixup']);
	});
});
