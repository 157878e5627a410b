import {
	isLiningNote,
	liningNote,
	liningSpecOf,
	type FabricEstimate,
	type FabricPlacement,
	type FabricSpec
} from '../fabric';
import { boundingBox, translate, type Point } from '../geometry';
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

/** What the draft API allows the marker: the last placement may run past it, so it stops short of 2 s (well inside the compute pool's 5 s). */
export const draftNestBudget: NestBudget = { budgetMs: 1800 };

/** The outline of a placement as the boxes laid it, corner at the origin: two halves joined when opened out. */
function laidOutline(p: FabricPlacement): Point[] {
	if (!p.unfolded) return [...p.shapes[0]];
	const whole = union(p.shapes.map((s) => toPath(s)));
	return toPoints(whole.reduce((a, b) => (b.length > a.length ? b : a)));
}

const near = (a: number, b: number) => Math.abs(a - b) < 1e-6;

/** A band the boxes laid across the cloth: its laid length runs across where the drafted one runs along. */
function crosswiseAsLaid(piece: DraftPiece, outline: readonly Point[]): boolean {
	if (!piece.mayCut?.crosswise) return false;
	const drafted = boundingBox(piece.outline);
	const laid = boundingBox(outline);
	return drafted.height >= drafted.width ? laid.width > laid.height : laid.height > laid.width;
}

/**
 * The grainline on the outline as laid: the piece's own when the piece lies as drafted (moved with it), else
 * — a band cut across the cloth or in two — the cloth's lengthwise grain through the middle of the piece.
 */
function laidGrainline(piece: DraftPiece, p: FabricPlacement, outline: readonly Point[]): [Point, Point] {
	const drafted = boundingBox(piece.outline);
	const laid = boundingBox(outline);
	const width = p.unfolded ? 2 * drafted.width : drafted.width;
	if (near(laid.width, width) && near(laid.height, drafted.height)) {
		const dx = (p.unfolded ? drafted.width : 0) - drafted.x;
		return translate(piece.grainline, dx, -drafted.y) as [Point, Point];
	}
	const x = laid.x + laid.width / 2;
	return [
		{ x, y: laid.y + laid.height * 0.2 },
		{ x, y: laid.y + laid.height * 0.8 }
	];
}

/**
 * The marker's items: the same cuts, in the same number and the same shapes (a band cut across or in two
 * as the boxes chose), as the boxes the rectangle estimate laid.
 */
export function markerItems(estimate: FabricEstimate, pieces: readonly DraftPiece[], spec: FabricSpec) {
	const byId = new Map(pieces.map((p) => [p.id, p]));
	const groups = new Map<string, { item: MarkerItem; yields: number; unfolded: boolean; crosswiseLaid: boolean }>();
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
		const outline = laidOutline(p);
		groups.set(key, {
			yields: p.yields / copies,
			unfolded: p.unfolded,
			item: {
				id: piece.id,
				label: piece.label,
				outline,
				grainline: laidGrainline(piece, p, outline),
				quantity: copies,
				rotation: spec.directional ? 'none' : '180',
				onFold: estimate.folded && piece.cut.onFold,
				mirrorPairs: !estimate.folded && piece.cut.pair,
				eitherHand: estimate.folded && piece.cut.pair && !piece.cut.onFold,
				crosswise: piece.mayCut?.crosswise ?? false
			},
			crosswiseLaid: p.unfolded ? false : crosswiseAsLaid(piece, outline)
		});
	}
	return [...groups.values()];
}

/** Of the draft's time allowance, the share the cloth marker gets when there is a lining to nest as well. */
const clothShareWhenLined = 0.65;

/**
 * The fabric estimate with the real outlines nested in place of their boxes, when that is shorter; a lined
 * garment's lining is nested as its own marker on the lining width, and its note gives the nested length.
 * The rectangle estimate is kept as it is when nesting does not finish within its budget.
 */
export function nestFabricEstimate(
	estimate: FabricEstimate,
	pieces: readonly DraftPiece[],
	spec: FabricSpec,
	budget: NestBudget
): FabricEstimate {
	const lining = estimate.lining;
	if (!lining?.estimate) return nestCloth(estimate, pieces, spec, budget);
	const started = performance.now();
	const cloth = nestCloth(estimate, pieces, spec, { ...budget, budgetMs: budget.budgetMs * clothShareWhenLined });
	const left = Math.max(budget.budgetMs - (performance.now() - started), budget.budgetMs * (1 - clothShareWhenLined));
	const liningPieces = pieces.filter((p) => p.cut.cloth === 'lining');
	const nestedLining = {
		...lining,
		estimate: nestCloth(lining.estimate, liningPieces, liningSpecOf(spec), { ...budget, budgetMs: left })
	};
	return {
		...cloth,
		notes: cloth.notes.map((n) => (isLiningNote(n) ? liningNote(nestedLining, spec.widthMm) : n)),
		lining: nestedLining
	};
}

function nestCloth(
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
	// A band the marker turned a quarter from how the boxes laid it: the note says which way it is cut now.
	const notes = [...estimate.notes];
	for (const [i, g] of groups.entries()) {
		const turned = marker.placements.filter((m) => m.item === i && (m.turn === 90 || m.turn === 270)).length;
		if (!turned) continue;
		const all = marker.placements.filter((m) => m.item === i).length;
		const across = `${g.item.label}: cut across the cloth (crosswise grain)`;
		const at = notes.findIndex((n) => n.startsWith(across));
		if (at >= 0) notes.splice(at, 1);
		const some = turned < all ? `${turned} of the ${all} pieces` : all > 1 ? 'every piece' : 'it';
		notes.push(
			g.crosswiseLaid
				? `${g.item.label}: cut along the grain (${some}), as the marker shows; that saves cloth.`
				: `${g.item.label}: cut across the cloth (crosswise grain) — ${some} — where the marker shows it; that saves cloth.`
		);
	}
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
		notes,
		nested: { boxLengthMm: estimate.packedMm, areaBoundMm: marker.areaBound }
	};
}
