import { pt, type Point } from '../geometry';
import type { MarkerItem } from './nest';

/** One piece for a marker test: cut once, not on the fold, end for end allowed, unless `extra` says otherwise. */
export const markerItem = (outline: Point[], extra: Partial<MarkerItem> = {}): MarkerItem => ({
	id: 'piece',
	label: 'Piece',
	outline,
	grainline: [pt(10, 10), pt(10, 50)],
	quantity: 1,
	rotation: '180',
	onFold: false,
	mirrorPairs: false,
	...extra
});
