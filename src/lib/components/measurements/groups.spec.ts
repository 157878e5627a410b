import { describe, expect, it } from 'vitest';
import { measurementCodes } from '$lib/drafting';
import { measurementGroups } from './groups';

describe('measurement groups', () => {
	it('show every measurement of the vocabulary exactly once', () => {
		const shown = measurementGroups.flatMap((group) => group.codes);
		expect([...shown].sort()).toEqual([...measurementCodes].sort());
	});
});
