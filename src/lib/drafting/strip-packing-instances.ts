import type { RectItem } from './layout';

/**
 * Hopper & Turton (2001) class C, instance C1-P1 (2DPackLib, University of Bologna): a zero-waste
 * packing of width 20, so OPT = A/W = 400/20 = 20; the tallest item is 12. Used by tests and the bench.
 */
export const hopperTurtonC1P1 = {
	width: 20,
	optimalHeight: 20,
	tallest: 12,
	items: [
		[2, 12],
		[7, 12],
		[8, 6],
		[3, 6],
		[3, 5],
		[5, 5],
		[3, 12],
		[3, 7],
		[5, 7],
		[2, 6],
		[3, 2],
		[4, 2],
		[3, 4],
		[4, 4],
		[9, 2],
		[11, 2]
	].map(([w, h]): RectItem => ({ w, h }))
};
