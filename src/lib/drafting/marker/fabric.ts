import {
	isLiningNote,
	liningNote,
	liningSpecOf,
	type FabricEstimate,
	type FabricPlacement,
	type FabricSpec
} from '../fabric';
import { boundingBox, pt, translate, type Point } from '../geometry';
import type { DraftPiece } from '../pieces';
import { formatFabricLength, formatLength, roundUpFabric, type Unit } from '../units';
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

type Group = NonNullable<ReturnType<typeof markerItems>>[number];

/**
 * A band the boxes laid whole that may also be cut in two (each half plus its join): the marker's items with
 * the halves instead, as the rectangle layout's own option; null when there is no such band.
 */
function bandInTwo(groups: readonly Group[], pieces: readonly DraftPiece[], unit: Unit) {
	const byId = new Map(pieces.map((p) => [p.id, p]));
	for (const [i, g] of groups.entries()) {
		const piece = byId.get(g.item.id);
		const join = piece?.mayCut?.inTwo?.joinMm;
		if (!piece || join === undefined || g.unfolded) continue;
		const drafted = boundingBox(piece.outline);
		const laid = boundingBox(g.item.outline);
		const whole = near(laid.width * laid.height, drafted.width * drafted.height);
		if (!whole) continue;
		const half = drafted.height / 2 + join;
		const outline = [pt(0, 0), pt(drafted.width, 0), pt(drafted.width, half), pt(0, half)];
		const x = drafted.width / 2;
		const item = {
			...g.item,
			outline,
			grainline: [pt(x, half * 0.2), pt(x, half * 0.8)] as [Point, Point],
			quantity: 2 * g.item.quantity,
			mirrorPairs: false,
			eitherHand: false
		};
		const halves: Group = { item, yields: g.yields, unfolded: false, crosswiseLaid: false };
		const note = `${piece.label}: cut in two pieces, each half the length plus ${formatLength(join, unit, { withUnit: true })} to join; seam them together before attaching. That saves cloth.`;
		return { groups: groups.map((other, j) => (j === i ? halves : other)), label: piece.label, note };
	}
	return null;
}

/** Share of the budget the items as the boxes laid them get when a band may also be nested in two. */
const asLaidShare = 0.6;

function nestCloth(
	estimate: FabricEstimate,
	pieces: readonly DraftPiece[],
	spec: FabricSpec,
	budget: NestBudget
): FabricEstimate {
	const laidGroups = markerItems(estimate, pieces, spec);
	if (!laidGroups?.length) return estimate;
	// No marker is shorter than its longest piece that cannot turn across: boxes already that short stand.
	const longest = Math.max(
		...laidGroups
			.filter((g) => !g.item.crosswise && g.item.rotation !== 'any')
			.map((g) => boundingBox(g.item.outline).height),
		0
	);
	if (estimate.packedMm <= longest + 1e-6) return estimate;
	const nest = (groups: readonly Group[], budgetMs: number) =>
		nestMarker(
			groups.map((g) => g.item),
			{
				width: estimate.layWidthMm,
				yStep: spec.repeatMm,
				budgetMs,
				orderings: budget.orderings,
				gapMm: budget.gapMm
			}
		);
	const unit: Unit = estimate.rounded.buyUnit === 'yd' ? 'in' : 'cm';
	const inTwo = bandInTwo(laidGroups, pieces, unit);
	const started = performance.now();
	let groups = laidGroups;
	let marker = nest(laidGroups, inTwo ? budget.budgetMs * asLaidShare : budget.budgetMs);
	const notes = [...estimate.notes];
	if (inTwo) {
		const left = Math.max(budget.budgetMs - (performance.now() - started), budget.budgetMs * (1 - asLaidShare));
		const halves = nest(inTwo.groups, left);
		if (halves && (!marker || halves.length < marker.length - 1e-6)) {
			marker = halves;
			groups = inTwo.groups;
			// The boxes' note on how the band is cut gives way to the halves'.
			const at = notes.findIndex((n) => n.startsWith(`${inTwo.label}: cut`));
			if (at >= 0) notes.splice(at, 1);
			notes.unshift(inTwo.note);
		}
	}
	if (!marker || marker.length >= estimate.packedMm - 1e-6) return estimate;
	// A band the marker turned a quarter from how the boxes laid it: the note says which way it is cut now.
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
		notes,
		nested: { boxLengthMm: estimate.packedMm, areaBoundMm: marker.areaBound }
	};
}
