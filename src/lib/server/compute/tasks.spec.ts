import { describe, expect, it } from 'vitest';
import { draftGarment } from '../../drafting/draft';
import { runTask } from './tasks';

/** A trousers draft from the drafting API's own tests (inches). */
const trousers = {
	garment: 'wide-leg-trousers' as const,
	unit: 'in' as const,
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};

describe('answer tasks (the JSON written on the worker)', () => {
	it('answers a draft with exactly the JSON of the draft', () => {
		const answer = runTask({ kind: 'answer', task: { kind: 'draft', request: trousers } });
		expect(answer).toEqual({ status: 200, body: JSON.stringify(draftGarment(trousers)) });
	});

	it('refuses a draft from implausible measurements with 422 and the field (ANSUR II maxima are under 2 m)', () => {
		const request = {
			garment: 'straight-skirt' as const,
			unit: 'cm' as const,
			measurements: { waist_girth: 72, hip_girth: 99_999, waist_to_hip: 20.6 }
		};
		const answer = runTask({ kind: 'answer', task: { kind: 'draft', request } }) as { status: number; body: string };
		expect(answer.status).toBe(422);
		const body = JSON.parse(answer.body) as { error: { code: string; issues: { path: string }[] } };
		expect(body.error.code).toBe('implausible_measurements');
		expect(body.error.issues.map((i) => i.path)).toEqual(['measurements.hip_girth']);
	});

	it('answers a layout with its JSON (hand check: four 5×5 squares fill a 10-wide strip to length 10)', () => {
		const answer = runTask({
			kind: 'answer',
			task: { kind: 'layout', request: { width: 10, unit: 'cm', pieces: [{ w: 5, h: 5, quantity: 4 }] } }
		}) as { status: number; body: string };
		expect(answer.status).toBe(200);
		expect(JSON.parse(answer.body)).toMatchObject({ length: 10, efficiency: 1 });
	});
});
