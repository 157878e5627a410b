import type { FabricEstimate, FabricPlacement, FabricSpec } from '../fabric';
import { boundingBox, mirrorX, translate, type Point } from '../geometry';
import type { DraftPiece } from '../pieces';
import { formatFabricLength, roundUpFabric } from '../units';
import { nestMarker, type MarkerItem } from './nest';
import { toPath, toPoints, union } from './polygons';

export interface NestBudget {
	/** No new ordering starts after this many ms; past it with none finished, the boxes stand. */
	budgetMs: number;
	orderings?: number;
	gapMm?: number;
}

/** What the draft API allows the marker, well inside the compute pool's 5 s. */
export const draftNestBudget: NestBudget = { budgetMs: 2000 };

/** A cut-on-fold piece opened out about its fold edge (the outline's least x). */
function openedOut(outline: readonly Point[]): Point[] {
	const fold = boundingBox(outline).x;
	const whole = union([toPath(outline), toPath(mirrorX(outline, fold))]);
	return toPoints(whole.reduce((a, b) => (b.length > a.length ? b : a)));
}

const quarterTurned = (outline: readonly Point[], p: FabricPlacement): Point[] => {
	const box = boundingBox(outline);
	const turned = Math.abs(p.w - box.height) < 1e-6 && Math.abs(p.h - box.width) < 1e-6 && box.width !== box.height;
	return turned ? outline.map((q) => ({ x: -q.y, y: q.x })) : [...outline];
};

/** The marker's items: the same cuts, in the same number, as the boxes the rectangle estimate laid. */
export function markerItems(estimate: FabricEstimate, pieces: readonly DraftPiece[], spec: FabricSpec) {
	const byId = new Map(pieces.map((p) => [p.id, p]));
	const groups = new Map<string, { item: MarkerItem; yields: number; unfolded: boolean }>();
	for (const p of estimate.placements) {
		const key = `${p.pieceId}|${p.unfolded}`;
		// A box laid head to tail holds two copies; an opened-out fold piece is one cut drawn in two halves.
		const copies = p.unfolded ? 1 : p.shapes.length;
		const group = groups.get(key);
		if (group) {
			group.item.quantity += copies;
			continue;
		}
		const piece = byId.get(p.pieceId);
		if (!piece) return null;
		const outline = quarterTurned(p.unfolded ? openedOut(piece.outline) : piece.outline, p);
		groups.set(key, {
			yields: p.yields / copies,
			unfolded: p.unfolded,
			item: {
				id: piece.id,
				label: piece.label,
				outline,
				grainline: piece.grainline,
				quantity: copies,
				rotation: spec.directional ? 'none' : '180',
				onFold: estimate.folded && piece.cut.onFold,
				mirrorPairs: !estimate.folded && piece.cut.pair
			}
		});
	}
	return [...groups.values()];
}

/**
 * The fabric estimate with the real outlines nested in place of their boxes, when that is shorter.
 * The rectangle estimate is kept as it is when nesting does not finish within its budget.
 */
export function nestFabricEstimate(
	estimate: FabricEstimate,
	pieces: readonly DraftPiece[],
	spec: FabricSpec,
	budget: NestBudget
): FabricEstimate {
	const groups = markerItems(estimate, pieces, spec);
	if (!groups?.length) return estimate;
	const marker = nestMarker(
		groups.map((g) => g.item),
		{
			width: estimate.layWidthMm,
			yStep: spec.repeatMm,
			budgetMs: budget.budgetMs,
			orderings: budget.orderings,
			gapMm: budget.gapMm
		}
	);
	if (!marker || marker.length >= estimate.packedMm - 1e-6) return estimate;
	const shrink = estimate.shrinkagePercent / 100;
	const lengthMm = marker.length / (1 - shrink);
	const buyUnit = estimate.rounded.buyUnit;
	const rounded = roundUpFabric(lengthMm, buyUnit);
	const placements: FabricPlacement[] = marker.placements.map((m) => {
		const { item, yields, unfolded } = groups[m.item];
		return {
			pieceId: item.id,
			label: item.label,
			x: m.box.x,
			y: m.box.y,
			w: m.box.width,
			h: m.box.height,
			origin: { x: 0, y: 0 },
			unfolded,
			yields,
			shapes: [translate(m.outline, -m.box.x, -m.box.y)],
			outline: m.outline,
			grainline: m.grainline
		};
	});
	return {
		...estimate,
		packedMm: marker.length,
		lengthMm,
		rounded: { ...rounded, buyUnit, display: formatFabricLength(rounded.value, buyUnit) },
		// The same cuts on a shorter length: the cloth used rises in the ratio of the lengths.
		efficiency: (estimate.efficiency * estimate.packedMm) / marker.length,
		placements,
		nested: { boxLengthMm: estimate.packedMm, areaBoundMm: marker.areaBound }
	};
}
