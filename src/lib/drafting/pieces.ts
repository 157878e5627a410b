import type { Finding } from './checks';
import type { CurvedPath, Point } from './geometry';

export type Grain = 'lengthwise' | 'crosswise';

export interface CutInstruction {
	/** How many of this piece the garment needs. */
	quantity: number;
	/** Cut with one edge (x = 0 in the outline) on a fold of the cloth. */
	onFold: boolean;
	/** The pieces are a mirrored left/right pair. */
	pair: boolean;
	grain: Grain;
	/** Cut from the lining rather than the garment cloth; the lining is laid and estimated apart. */
	cloth?: 'lining';
}

/** A dimension drawn on the piece: a line from `from` to `to`, labelled with the line's value. */
export interface Dimension {
	from: Point;
	to: Point;
}

export interface PieceLine {
	/** Stable snake_case id, unique within the piece. */
	id: string;
	label: string;
	mm: number;
	dimension?: Dimension;
}

export type MarkKind = 'dart' | 'guide' | 'zip' | 'slit' | 'fold';

/** Construction marks drawn inside or along the outline. */
export interface PieceMark {
	kind: MarkKind;
	points: Point[];
	label?: string;
}

export interface DraftPiece {
	id: string;
	label: string;
	cut: CutInstruction;
	/** Closed outline, mm, cutting line (seam allowances included). */
	outline: Point[];
	/** The same outline with its curves, for drawing; `outline` is this flattened to 1 mm. */
	path?: CurvedPath;
	marks: PieceMark[];
	lines: PieceLine[];
	grainline: [Point, Point];
	/** Other ways the cutter may cut a plain rectangle when that saves cloth (a long waistband). */
	mayCut?: { crosswise: boolean; inTwo?: { joinMm: number } };
}

export interface Allowance {
	id: string;
	label: string;
	mm: number;
}

export interface Caution {
	code: string;
	message: string;
}

export interface TemplateDraft {
	pieces: DraftPiece[];
	allowances: Allowance[];
	notes: string[];
	cautions: Caution[];
	warnings: Finding[];
}
