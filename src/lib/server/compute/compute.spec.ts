import { describe, expect, it } from 'vitest';
import { compute, OverBudget } from './index';

describe('compute pool', () => {
	it('works a layout out on a worker thread (hand check: four 5×5 squares fill a 10-wide strip to length 10)', async () => {
		const result = await compute({
			kind: 'layout',
			request: { width: 10, unit: 'cm', pieces: [{ w: 5, h: 5, quantity: 4 }] }
		});
		expect(result).toMatchObject({ length: 10, efficiency: 1 });
	}, 60_000);

	it('stops a computation that runs past its budget', async () => {
		const request = {
			width: 150,
			unit: 'cm' as const,
			pieces: [{ w: 3, h: 7, quantity: 100, rotate: 'any' as const }]
		};
		// A zero budget is over before any worker can answer.
		await expect(compute({ kind: 'layout', request }, { budgetMs: 0 })).rejects.toBeInstanceOf(OverBudget);
	});
});
