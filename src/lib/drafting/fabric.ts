import type { Finding } from './checks';
import { boundingBox, mirrorX, polygonArea, pt, quarterTurn, translate, type Point } from './geometry';
import { headToTailOffset, secondCopy } from './head-to-tail';
import { packStrip } from './layout';
import type { DraftPiece } from './pieces';
import { formatFabricLength, formatLength, roundUpFabric, toMm, type BuyUnit, type Unit } from './units';

/** Bolt widths: 36/45/54/60 in are the common US widths; 90/115/140/150 cm are sold by the metre. */
export const fabricWidthPresets: Readonly<Record<Unit, readonly number[]>> = {
	in: [36, 45, 54, 60],
	cm: [90, 115, 140, 150]
};

export const defaultFabricWidth: Readonly<Record<Unit, number>> = { in: 45, cm: 115 };

export interface FabricSpec {
	widthMm: number;
	/** Folded selvedge to selvedge: half the width, two layers, fold along x = 0. */
	folded: boolean;
	/** One-way print or nap: pieces may not be turned at all. */
	directional: boolean;
	shrinkagePercent: number;
	repeatMm: number;
}

export interface FabricPlacement {
	pieceId: string;
	label: string;
	x: number;
	y: number;
	w: number;
	h: number;
	/** The piece's own box origin, to map its outline into the placement. */
	origin: { x: number; y: number };
	/** On open fabric a cut-on-fold piece is laid out whole (mirrored about its fold). */
	unfolded: boolean;
	/** How many pieces this placement cuts (two for a pair on folded cloth, twice that laid head to tail). */
	yields: number;
	/** The outlines as laid, relative to the placement's corner. */
	shapes: Point[][];
	/** Set when the real outline was nested: the cutting line and grainline on the cloth. */
	outline?: Point[];
	grainline?: [Point, Point];
}

export interface FabricEstimate {
	widthMm: number;
	/** The width the pieces are laid on after shrinkage, halved when folded. */
	layWidthMm: number;
	folded: boolean;
	directional: boolean;
	/** Packed length before shrinkage is added back. */
	packedMm: number;
	/** Length to buy before rounding, shrinkage included. */
	lengthMm: number;
	rounded: { value: number; buyUnit: BuyUnit; mm: number; display: string };
	efficiency: number;
	placements: FabricPlacement[];
	/** Shrinkage allowed for, percent. */
	shrinkagePercent: number;
	/** How to cut what the layout alone does not say (a single piece on doubled cloth, a band cut another way). */
	notes: string[];
	/** Set when the pieces' real outlines were nested (see marker/): what the boxes alone would take. */
	nested?: { boxLengthMm: number; areaBoundMm: number };
	/** The pieces cut in lining, laid apart on their own cloth (absent for an unlined garment). */
	lining?: LiningLayout;
}

/** A lined garment's lining: its pieces laid on lining as wide as the cloth, plain (any way up end for end). */
export interface LiningLayout {
	/** The lining pieces' names, lower case, for the note. */
	names: string;
	unit: Unit;
	/** Null when a lining piece is wider than the lining. */
	estimate: FabricEstimate | null;
}

/** The lining's own cloth: as wide as the garment cloth, no nap or repeat (a lining has neither). */
export const liningSpecOf = (spec: FabricSpec): FabricSpec => ({ ...spec, directional: false, repeatMm: 0 });

/** The note beside the layout giving the lining's length to buy. */
export function liningNote(lining: LiningLayout, widthMm: number): string {
	const width = formatLength(widthMm, lining.unit, { withUnit: true });
	return lining.estimate
		? `Lining (${lining.names}): ${lining.estimate.rounded.display} of ${width} lining, laid apart from the cloth; see the lining layout.`
		: `Lining (${lining.names}): too wide for ${width} lining; choose a wider lining.`;
}

export const isLiningNote = (note: string) => note.startsWith('Lining (');

interface LayItem {
	piece: DraftPiece;
	w: number;
	h: number;
	quantity: number;
	anchorLeft: boolean;
	unfolded: boolean;
	yields: number;
	/** Cloth one placement uses, over all its layers. */
	clothArea: number;
	shapes: Point[][];
}

function layItems(pieces: readonly DraftPiece[], folded: boolean): LayItem[] {
	return pieces.map((piece) => {
		const box = boundingBox(piece.outline);
		const area = polygonArea(piece.outline);
		const shape = translate(piece.outline, -box.x, -box.y);
		const { quantity, onFold, pair } = piece.cut;
		const plain: LayItem = {
			piece,
			w: box.width,
			h: box.height,
			quantity,
			anchorLeft: false,
			unfolded: false,
			yields: 1,
			clothArea: area,
			shapes: [shape]
		};
		// On folded cloth a fold piece sits against the fold, and one cut gives both halves of a pair.
		if (folded && onFold) return { ...plain, anchorLeft: true, clothArea: 2 * area };
		if (folded && pair) return { ...plain, quantity: Math.ceil(quantity / 2), yields: 2, clothArea: 2 * area };
		// On open cloth a fold piece is cut out whole, twice as wide.
		if (!folded && onFold)
			return {
				...plain,
				w: 2 * box.width,
				unfolded: true,
				clothArea: 2 * area,
				shapes: [translate(shape, box.width, 0), translate(mirrorX(shape), box.width, 0)]
			};
		return plain;
	});
}

/** Without nap, copies laid in twos head to tail where that takes less width than side by side. */
function headToTail(items: readonly LayItem[], layWidth: number): LayItem[] {
	return items.flatMap((item) => {
		if (item.quantity < 2 || item.anchorLeft || item.unfolded) return [item];
		const mirrored = item.piece.cut.pair && item.yields === 1;
		const offset = headToTailOffset(item.shapes[0], item.w, item.h, mirrored);
		if (offset + item.w > Math.min(2 * item.w - 1, layWidth - 1e-6)) return [item];
		const pairs: LayItem = {
			...item,
			w: offset + item.w,
			quantity: Math.floor(item.quantity / 2),
			yields: 2 * item.yields,
			clothArea: 2 * item.clothArea,
			shapes: [item.shapes[0], secondCopy(item.shapes[0], item.w, item.h, mirrored, offset)]
		};
		return item.quantity % 2 ? [pairs, { ...item, quantity: 1 }] : [pairs];
	});
}

/** The band as drafted, across the cloth, or in two halves each with a join allowance. */
function bandVariants(
	pieces: readonly DraftPiece[],
	layWidth: number,
	unit: Unit
): Array<{ pieces: DraftPiece[]; note?: string }> {
	const variants: Array<{ pieces: DraftPiece[]; note?: string }> = [{ pieces: [...pieces] }];
	pieces.forEach((piece, i) => {
		const box = boundingBox(piece.outline);
		const swap = (other: DraftPiece) => pieces.map((p, j) => (j === i ? other : p));
		if (piece.mayCut?.crosswise && box.height < layWidth - 1e-6) {
			variants.push({
				pieces: swap({
					...piece,
					outline: quarterTurn(piece.outline, box),
					cut: { ...piece.cut, grain: 'crosswise' }
				}),
				note: `${piece.label}: cut across the cloth (crosswise grain), where the layout shows it; that saves cloth.`
			});
		}
		const join = piece.mayCut?.inTwo?.joinMm;
		if (join !== undefined) {
			const half = box.height / 2 + join;
			variants.push({
				pieces: swap({
					...piece,
					outline: [
						pt(box.x, box.y),
						pt(box.x + box.width, box.y),
						pt(box.x + box.width, box.y + half),
						pt(box.x, box.y + half)
					],
					cut: { ...piece.cut, quantity: 2 * piece.cut.quantity, pair: true }
				}),
				note: `${piece.label}: cut in two pieces, each half the length plus ${formatLength(join, unit, { withUnit: true })} to join; seam them together before attaching. That saves cloth.`
			});
		}
	});
	return variants;
}
/**
 * Lays the pieces on the cloth and reports the length to buy. Null when the cloth is too narrow. Pieces cut
 * in lining are laid apart, on lining as wide as the cloth (plain, so it may turn end for end), and their
 * length is given in the notes.
 */
export function estimateFabric(
	pieces: readonly DraftPiece[],
	spec: FabricSpec,
	unit: Unit
): { estimate: FabricEstimate | null; warnings: Finding[] } {
	const lining = pieces.filter((p) => p.cut.cloth === 'lining');
	if (!lining.length) return estimateCloth(pieces, spec, unit);
	const main = estimateCloth(
		pieces.filter((p) => p.cut.cloth !== 'lining'),
		spec,
		unit
	);
	const laid = estimateCloth(lining, liningSpecOf(spec), unit);
	const layout: LiningLayout = {
		names: lining.map((p) => p.label.toLowerCase()).join(', '),
		unit,
		estimate: laid.estimate
	};
	const note = liningNote(layout, spec.widthMm);
	return {
		estimate: main.estimate && { ...main.estimate, notes: [...main.estimate.notes, note], lining: layout },
		warnings: [...main.warnings, ...laid.warnings.map((w) => ({ ...w, message: `Lining: ${w.message}` }))]
	};
}

function estimateCloth(
	pieces: readonly DraftPiece[],
	spec: FabricSpec,
	unit: Unit
): { estimate: FabricEstimate | null; warnings: Finding[] } {
	const shrink = Math.min(Math.max(spec.shrinkagePercent, 0), 50) / 100;
	const usable = spec.widthMm * (1 - shrink);
	const warnings: Finding[] = [];
	let folded = spec.folded;
	let items = layItems(pieces, folded);
	let layWidth = folded ? usable / 2 : usable;
	if (folded && items.some((i) => i.w > layWidth + 1e-6)) {
		folded = false;
		items = layItems(pieces, false);
		layWidth = usable;
		warnings.push({
			code: 'fabric_too_narrow',
			fields: ['fabric.width'],
			message: 'Some pieces are wider than the folded cloth, so the layout uses it opened out.'
		});
	}
	const tooWide = items.filter((i) => i.w > layWidth + 1e-6);
	if (tooWide.length) {
		const names = tooWide.map((i) => `${i.piece.label} (${formatLength(i.w, unit, { withUnit: true })})`).join(', ');
		warnings.push({
			code: 'fabric_too_narrow',
			fields: ['fabric.width'],
			message: `Too wide for ${formatLength(spec.widthMm, unit, { withUnit: true })} cloth: ${names}. Choose a wider cloth or add a seam.`
		});
		return { estimate: null, warnings };
	}
	const buyUnit: BuyUnit = unit === 'in' ? 'yd' : 'm';
	const toBuy = (packedMm: number) => roundUpFabric(packedMm / (1 - shrink), buyUnit).mm;
	// With nap every piece lies one way up; without it, copies may also lie head to tail.
	const lay = (chosen: readonly DraftPiece[]) => {
		const plain = layItems(chosen, folded);
		const tries = spec.directional ? [plain] : [plain, headToTail(plain, layWidth)];
		return tries
			.map((laid) => ({
				items: laid,
				packed: packStrip(
					laid.map((i) => ({
						w: i.w,
						h: i.h,
						quantity: i.quantity,
						anchorLeft: i.anchorLeft,
						rotate: 'none' as const
					})),
					layWidth,
					{ yStep: spec.repeatMm }
				)
			}))
			.reduce((best, next) => (next.packed.length < best.packed.length - 1e-9 ? next : best));
	};
	let best: ReturnType<typeof lay> & { pieces: readonly DraftPiece[]; note?: string } = { ...lay(pieces), pieces };
	for (const variant of bandVariants(pieces, layWidth, unit).slice(1)) {
		const laid = lay(variant.pieces);
		if (toBuy(laid.packed.length) < toBuy(best.packed.length) - 1e-6) best = { ...laid, ...variant };
	}
	const { packed } = best;
	const placements: FabricPlacement[] = packed.placements.map((p) => {
		const item = best.items[p.item];
		const box = boundingBox(item.piece.outline);
		return {
			pieceId: item.piece.id,
			label: item.piece.label,
			x: p.x,
			y: p.y,
			w: p.w,
			h: p.h,
			origin: { x: box.x, y: box.y },
			unfolded: item.unfolded,
			yields: item.yields,
			shapes: item.shapes
		};
	});
	const cutArea = packed.placements.reduce((sum, p) => sum + best.items[p.item].clothArea, 0);
	const clothArea = usable * packed.length;
	const lengthMm = packed.length / (1 - shrink);
	// Doubled cloth cuts two of everything; a piece wanted once is cut through one layer (common practice).
	const cutSingle = folded
		? best.pieces
				.filter((p) => !p.cut.onFold && !p.cut.pair && p.cut.quantity % 2 === 1)
				.map(
					(p) =>
						`${p.label}: cut ${p.cut.quantity} — on the folded cloth cut through the top layer only (cut single), or keep the second as a spare.`
				)
		: [];
	const rounded = roundUpFabric(lengthMm, buyUnit);
	return {
		estimate: {
			widthMm: spec.widthMm,
			layWidthMm: layWidth,
			folded,
			directional: spec.directional,
			packedMm: packed.length,
			lengthMm,
			rounded: { ...rounded, buyUnit, display: formatFabricLength(rounded.value, buyUnit) },
			efficiency: clothArea > 0 ? cutArea / clothArea : 0,
			placements,
			shrinkagePercent: shrink * 100,
			notes: [...(best.note ? [best.note] : []), ...cutSingle]
		},
		warnings
	};
}

export function defaultFabricSpec(unit: Unit): FabricSpec {
	return {
		widthMm: toMm(defaultFabricWidth[unit], unit),
		folded: true,
		directional: false,
		shrinkagePercent: 0,
		repeatMm: 0
	};
}
