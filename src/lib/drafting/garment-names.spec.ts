import { describe, expect, it } from 'vitest';
import { garmentNames, isGarmentId } from './garment-names';
import { garmentIds } from './measurements';
import { garments, templates } from './templates/index';

describe('garmentNames', () => {
	it('names every garment exactly as its template does', () => {
		expect(Object.keys(garmentNames).sort()).toEqual([...garmentIds].sort());
		for (const id of garmentIds) expect(garmentNames[id]).toBe(templates[id].name);
		expect(garments.map((g) => garmentNames[g.id])).toEqual(garments.map((g) => g.name));
	});

	it('knows catalogue ids from anything else, including names inherited by every object', () => {
		expect(isGarmentId('shirt')).toBe(true);
		expect(isGarmentId('morning-coat')).toBe(false);
		expect(isGarmentId('constructor')).toBe(false);
		expect(isGarmentId('toString')).toBe(false);
	});
});
