import { packStrip } from './layout';
import { estimateQuote, type QuoteEstimate } from './quote';
import { layoutRequestSchema, quoteRequestSchema, type LayoutRequest, type QuoteRequest } from './schemas';
import { getTemplate } from './templates/index';
import type { Unit } from './units';

export interface LayoutResponse {
	unit: Unit;
	width: number;
	length: number;
	efficiency: number;
	lowerBound: number;
	algorithm: string;
	placements: Array<{ piece: number; copy: number; x: number; y: number; w: number; h: number; rotated: boolean }>;
}

const round = (value: number) => Math.round(value * 1e6) / 1e6;

/** POST /api/v1/layouts: any rectangles on a strip, in the request's unit. */
export function layoutRectangles(request: LayoutRequest): LayoutResponse {
	const parsed = layoutRequestSchema.parse(request);
	const result = packStrip(parsed.pieces, parsed.width);
	return {
		unit: parsed.unit,
		width: parsed.width,
		length: round(result.length),
		efficiency: Math.round(result.efficiency * 1000) / 1000,
		lowerBound: round(result.lowerBound),
		algorithm: result.algorithm,
		placements: result.placements.map((p) => ({
			piece: p.item,
			copy: p.copy,
			x: round(p.x),
			y: round(p.y),
			w: p.w,
			h: p.h,
			rotated: p.rotated
		}))
	};
}

/** POST /api/v1/quotes/estimate: labour hours default to the garment's. */
export function estimateQuoteRequest(request: QuoteRequest): QuoteEstimate & { labourHours: number } {
	const parsed = quoteRequestSchema.parse(request);
	const labourHours = parsed.labourHours ?? getTemplate(parsed.garment!).defaultLabourHours;
	return { ...estimateQuote({ ...parsed, labourHours }), labourHours };
}
