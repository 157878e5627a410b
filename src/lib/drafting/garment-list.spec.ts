import { describe, expect, it } from 'vitest';
import { listGarments } from './garment-list';

describe('listGarments', () => {
	it('shows length options in the viewer’s unit', () => {
		const trousers = listGarments('in').find((g) => g.id === 'wide-leg-trousers')!;
		expect(trousers.requiredMeasurements).toEqual(['hip_girth', 'waist_girth', 'thigh_girth']);
		expect(trousers.options.find((o) => o.id === 'seamAllowance')).toMatchObject({
			kind: 'length',
			unit: 'in',
			default: 1,
			min: 0.25,
			max: 1.5
		});
		expect(trousers.options.find((o) => o.id === 'length')).toMatchObject({
			default: null,
			defaultFrom: 'waist_to_floor'
		});
		const inCm = listGarments('cm').find((g) => g.id === 'wide-leg-trousers')!;
		expect(inCm.options.find((o) => o.id === 'seamAllowance')).toMatchObject({ unit: 'cm', default: 2.54 });
	});
	it('keeps choices and booleans as they are', () => {
		const tunic = listGarments('cm').find((g) => g.id === 'tunic')!;
		expect(tunic.options.find((o) => o.id === 'fit')).toMatchObject({ kind: 'choice', default: 'regular' });
		expect(tunic.options.find((o) => o.id === 'neckTies')).toMatchObject({ kind: 'boolean', default: false });
	});
});
