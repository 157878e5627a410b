import type { Finding } from './checks';
import { boundingBox, polygonArea, type Point } from './geometry';
import { packStrip, type Rotation } from './layout';
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
	/** How many pieces this placement cuts (two for a pair on folded cloth). */
	yields: number;
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
	/** How to cut what the layout alone does not say (a single piece on doubled cloth). */
	notes: string[];
	/** Set when the pieces' real outlines were nested (see marker/): what the boxes alone would take. */
	nested?: { boxLengthMm: number; areaBoundMm: number };
}

interface LayItem {
	piece: DraftPiece;
	w: number;
	h: number;
	quantity: number;
	anchorLeft: boolean;
	unfolded: boolean;
	yields: number;
	areaPerCut: number;
}

function layItems(pieces: readonly DraftPiece[], folded: boolean): LayItem[] {
	return pieces.map((piece) => {
		const box = boundingBox(piece.outline);
		const area = polygonArea(piece.outline);
		const { quantity, onFold, pair } = piece.cut;
		const plain: LayItem = {
			piece,
			w: box.width,
			h: box.height,
			quantity,
			anchorLeft: false,
			unfolded: false,
			yields: 1,
			areaPerCut: area
		};
		// On folded cloth a fold piece sits against the fold, and one cut gives both halves of a pair.
		if (folded && onFold) return { ...plain, anchorLeft: true, areaPerCut: 2 * area };
		if (folded && pair) return { ...plain, quantity: Math.ceil(quantity / 2), yields: 2 };
		// On open cloth a fold piece is cut out whole, twice as wide.
		if (!folded && onFold) return { ...plain, w: 2 * box.width, unfolded: true, areaPerCut: 2 * area };
		return plain;
	});
}

/** Lays the pieces' boxes on the cloth and reports the length to buy. Null when the cloth is too narrow. */
export function estimateFabric(
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
	const rotate: Rotation = spec.directional ? 'none' : '180';
	const packed = packStrip(
		items.map((i) => ({ w: i.w, h: i.h, quantity: i.quantity, anchorLeft: i.anchorLeft, rotate })),
		layWidth,
		{ yStep: spec.repeatMm }
	);
	const placements: FabricPlacement[] = packed.placements.map((p) => {
		const item = items[p.item];
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
			yields: item.yields
		};
	});
	const cutArea = packed.placements.reduce((sum, p) => sum + items[p.item].areaPerCut * items[p.item].yields, 0);
	const clothArea = usable * packed.length;
	const lengthMm = packed.length / (1 - shrink);
	const buyUnit: BuyUnit = unit === 'in' ? 'yd' : 'm';
	// Doubled cloth cuts two of everything; a piece wanted once is cut through one layer (common practice).
	const notes = folded
		? items
				.filter((i) => !i.piece.cut.onFold && !i.piece.cut.pair && i.piece.cut.quantity % 2 === 1)
				.map(
					(i) =>
						`${i.piece.label}: cut ${i.piece.cut.quantity} — on the folded cloth cut through the top layer only (cut single), or keep the second as a spare.`
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
			notes
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
