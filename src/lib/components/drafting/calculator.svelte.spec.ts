import { describe, expect, it } from 'vitest';
import { DraftCalculator } from './calculator.svelte';

describe('DraftCalculator', () => {
	it('shows no draft and reports nothing until the drafting code is loaded, then drafts what was typed', async () => {
		const calc = new DraftCalculator('straight-skirt', 'cm');
		calc.measurementTexts = { waist_girth: '72', hip_girth: '96', waist_to_hip: '20.6' };
		expect(calc.drafter).toBeNull();
		expect(calc.result.pieces).toEqual([]);
		expect(calc.result.errors).toEqual([]);
		expect(calc.result.name).toBe(calc.template.name);
		await Promise.all([calc.load(), calc.load()]);
		expect(calc.result.errors).toEqual([]);
		expect(calc.result.pieces.length).toBeGreaterThan(0);
	});

	it('drafts the trousers worked example in inches (common practice: hip 40 → hip width 11)', async () => {
		const calc = new DraftCalculator('wide-leg-trousers', 'in');
		await calc.load();
		calc.fillExample();
		expect(calc.unit).toBe('in');
		expect(calc.missingCount).toBe(0);
		const front = calc.result.pieces.find((p) => p.id === 'front')!;
		expect(front.lines.find((l) => l.id === 'hip_width')!.display).toBe('11 in');
		expect(calc.result.fabric?.buyUnit).toBe('yd');
	});

	it('switching units rewrites the entries without changing the body', async () => {
		const calc = new DraftCalculator('wide-leg-trousers', 'in');
		await calc.load();
		calc.fillExample();
		calc.setUnit('cm');
		expect(calc.measurementTexts.hip_girth).toBe('101.6');
		expect(calc.optionTexts.length).toBe('115.6');
		const front = calc.result.pieces.find((p) => p.id === 'front')!;
		expect(front.lines.find((l) => l.id === 'hip_width')!.display).toBe('27.9 cm');
		calc.setUnit('in');
		expect(calc.measurementTexts.hip_girth).toBe('40');
	});

	it('reports unreadable entries and counts what is missing', async () => {
		const calc = new DraftCalculator('cropped-top', 'cm');
		await calc.load();
		calc.measurementTexts = { bust_girth: 'ninety' };
		expect(calc.measurements.problems.bust_girth).toMatch(/not a length/);
		expect(calc.missingCount).toBe(4);
		expect(calc.result.pieces).toEqual([]);
	});

	it('attaches findings to the field they are about', async () => {
		const calc = new DraftCalculator('a-line-skirt', 'cm');
		await calc.load();
		calc.measurementTexts = { waist_girth: '72', hip_girth: '38', waist_to_hip: '20' };
		expect(calc.findingsFor('hip_girth').errors[0].code).toBe('unit_mixup');
	});

	it('stops a cm form typed in inches and drafts it after one click on “read as inches”', async () => {
		// The EN 13402-3 body 88-72-96 cm in inches: waist 28 ¼, hip 37 ¾, waist to hip 8 ⅛.
		const calc = new DraftCalculator('straight-skirt', 'cm');
		await calc.load();
		calc.measurementTexts = { waist_girth: '28 1/4', hip_girth: '37 3/4', waist_to_hip: '8 1/8' };
		expect(calc.result.pieces).toEqual([]);
		expect(calc.suggestedUnit).toBe('in');
		calc.readAs('in');
		expect(calc.measurementTexts.hip_girth).toBe('37 3/4');
		expect(calc.result.errors).toEqual([]);
		expect(calc.result.pieces.length).toBeGreaterThan(0);
	});

	it('drafts the numbers as typed once the person confirms the unit', async () => {
		const calc = new DraftCalculator('straight-skirt', 'cm');
		await calc.load();
		calc.measurementTexts = { waist_girth: '28', hip_girth: '38', waist_to_hip: '20' };
		expect(calc.unitQuestion).toBe(true);
		calc.confirmUnit();
		expect(calc.unitQuestion).toBe(false);
		expect(calc.result.pieces.length).toBeGreaterThan(0);
	});

	it('keeps the fabric width preset when switching units (45 in ↔ 115 cm)', async () => {
		const calc = new DraftCalculator('tunic', 'in');
		await calc.load();
		calc.fillExample();
		calc.setUnit('cm');
		expect(calc.widthPresets[calc.widthIndex]).toBe(115);
		calc.setUnit('in');
		expect(calc.widthPresets[calc.widthIndex]).toBe(45);
	});

	it('fills the worked example in the unit and on the cloth already chosen', async () => {
		const calc = new DraftCalculator('wide-leg-trousers', 'cm');
		await calc.load();
		calc.widthIndex = 2;
		calc.fillExample();
		expect(calc.unit).toBe('cm');
		expect(calc.measurementTexts.hip_girth).toBe('101.6');
		expect(calc.widthPresets[calc.widthIndex]).toBe(140);
	});

	it('offers round metric allowances in centimetres (metric patterns use 1.5 cm for the ⅝ in seam; common practice)', async () => {
		const calc = new DraftCalculator('straight-skirt', 'cm');
		await calc.load();
		calc.fillExample();
		expect(calc.result.allowances.find((a) => a.id === 'seam')!.display).toBe('1.5 cm');
		calc.setUnit('in');
		expect(calc.result.allowances.find((a) => a.id === 'seam')!.display).toBe('5/8 in');
	});

	it('drafts the shirt and the waistcoat from their worked examples, with the waistcoat’s button count and pockets as chosen', async () => {
		const shirt = new DraftCalculator('shirt', 'cm');
		await shirt.load();
		shirt.fillExample();
		expect(shirt.missingCount).toBe(0);
		expect(shirt.result.errors).toEqual([]);
		expect(shirt.result.pieces.map((p) => p.id)).toEqual(['front', 'back', 'sleeve', 'collar_stand', 'collar']);

		const waistcoat = new DraftCalculator('waistcoat', 'cm');
		await waistcoat.load();
		waistcoat.fillExample();
		const buttons = () => Number(/^(\d+) buttons/.exec(waistcoat.result.notes.find((n) => /buttons;/.test(n))!)![1]);
		expect(waistcoat.result.pieces.map((p) => p.id)).toContain('breast_welt');
		expect(buttons()).toBe(5);
		waistcoat.choices = { buttons: '6' };
		waistcoat.switches = { breastPocket: false };
		expect(buttons()).toBe(6);
		expect(waistcoat.result.pieces.map((p) => p.id)).not.toContain('breast_welt');
		// The lining is laid apart from the cloth and its length given beside the layout.
		expect(waistcoat.result.fabric!.notes.some((n) => n.startsWith('Lining'))).toBe(true);
		waistcoat.chooseGarment('shirt');
		expect(waistcoat.choices).toEqual({});
	});
});
