import { checkMeasurements, isChildBody, type Finding } from './checks';
import { defaultFabricSpec, estimateFabric, type FabricSpec, type LiningLayout } from './fabric';
import { boundingBox } from './geometry';
import { nestFabricEstimate, type NestBudget } from './marker/index';
import type { GarmentId, MeasurementCode, Measurements } from './measurements';
import { resolveOptions, type GivenOptions } from './options';
import type { Caution, DraftPiece } from './pieces';
import { draftRequestSchema, type DraftRequest } from './schemas';
import { sizeBand, type SizeBand } from './size-band';
import { cutText, layoutSvg, pieceSvg } from './svg';
import { getTemplate } from './templates/index';
import type { OptionValue } from './templates/types';
import { formatLength, toMm, toUnitValue, type BuyUnit, type Unit } from './units';

export interface LineOut {
	id: string;
	label: string;
	value: number;
	display: string;
}

export interface PieceOut {
	id: string;
	label: string;
	cut: DraftPiece['cut'] & { text: string };
	lines: LineOut[];
	svg: string;
	bbox: { width: number; height: number };
	outlineMm: Array<[number, number]>;
}

export interface FabricOut {
	width: number;
	folded: boolean;
	directional: boolean;
	length: number;
	lengthRounded: number;
	buyUnit: BuyUnit;
	lengthDisplay: string;
	efficiency: number;
	svg: string;
	/** Length the layout takes on the cloth before shrinkage is added back (request unit). */
	packedLength: number;
	shrinkagePercent: number;
	/** What rounding up to the buying step (⅛ yd or 10 cm) added (request unit). */
	roundingAdded: number;
	notes: string[];
	/** The real outlines were nested on the cloth (else their boxes were packed). */
	nested: boolean;
	/** A lined garment's lining, laid apart on lining as wide as the cloth; null when unlined. */
	lining: LiningOut | null;
}

/** The lining's own layout: what to buy and the picture, like the cloth's. */
export interface LiningOut {
	/** The lining's pieces, in words. */
	pieces: string;
	/** False when a lining piece is wider than the lining (then there is no layout). */
	fits: boolean;
	width: number;
	folded: boolean;
	length: number;
	lengthRounded: number;
	buyUnit: BuyUnit;
	lengthDisplay: string;
	efficiency: number;
	svg: string;
	nested: boolean;
}

export interface DraftResponse {
	garment: GarmentId;
	name: string;
	unit: Unit;
	method: string;
	pieces: PieceOut[];
	fabric: FabricOut | null;
	sizeBand: SizeBand | null;
	allowances: LineOut[];
	notes: string[];
	cautions: Caution[];
	warnings: Finding[];
	errors: Finding[];
}

/** Input to the drafting core: measurements and length options in mm; `unit` is how results are shown. */
export interface DraftInputMm {
	garment: GarmentId;
	unit: Unit;
	bodyMm: Measurements;
	optionsMm?: GivenOptions;
	fabric?: Partial<FabricSpec>;
	/** The person has confirmed the numbers are in `unit`, answering a suspected unit mix-up. */
	unitConfirmed?: boolean;
	/** Nest the real outlines within this budget (the boxes stand if it runs out); boxes only when absent. */
	nest?: NestBudget;
}

export const childCaution: Caution = {
	code: 'child_garment',
	message:
		'These look like a child’s measurements. No drawstrings or cords at the hood or neck (EN 14682; 16 CFR 1120 in the US), keep waist cords short and bar-tacked, and note that children’s sleepwear has its own flammability rules (16 CFR 1615/1616). Follow your local code.'
};

const line = (id: string, label: string, mm: number, unit: Unit): LineOut => ({
	id,
	label,
	value: toUnitValue(mm, unit),
	display: formatLength(mm, unit, { withUnit: true })
});

function cautionsFor(body: Measurements, templateCautions: Caution[]): Caution[] {
	const cautions = [...templateCautions];
	if (isChildBody(body)) cautions.push(childCaution);
	return cautions;
}

function pieceOut(piece: DraftPiece, unit: Unit): PieceOut {
	const box = boundingBox(piece.outline);
	return {
		id: piece.id,
		label: piece.label,
		cut: { ...piece.cut, text: cutText(piece.cut) },
		lines: piece.lines.map((l) => line(l.id, l.label, l.mm, unit)),
		svg: pieceSvg(piece, unit),
		bbox: { width: toUnitValue(box.width, unit), height: toUnitValue(box.height, unit) },
		outlineMm: piece.outline.map((p) => [Math.round((p.x - box.x) * 100) / 100, Math.round((p.y - box.y) * 100) / 100])
	};
}

function liningOut(lining: LiningLayout, widthMm: number, unit: Unit): LiningOut {
	const e = lining.estimate;
	return {
		pieces: lining.names,
		fits: e !== null,
		width: toUnitValue(widthMm, unit),
		folded: e?.folded ?? false,
		length: e ? toUnitValue(e.lengthMm, unit) : 0,
		lengthRounded: e?.rounded.value ?? 0,
		buyUnit: e?.rounded.buyUnit ?? (unit === 'in' ? 'yd' : 'm'),
		lengthDisplay: e?.rounded.display ?? '',
		efficiency: e ? Math.round(e.efficiency * 1000) / 1000 : 0,
		svg: e ? layoutSvg(e, unit, 'lining') : '',
		nested: Boolean(e?.nested)
	};
}

/** The drafting core: checks, options, template, fabric layout and size band, all from millimetres. */
export function draftGarmentMm(input: DraftInputMm): DraftResponse {
	return draftWithPieces(input).response;
}

/** The draft and the pieces it was made from (none when the draft is stopped), for full-size printing. */
export function draftWithPieces(input: DraftInputMm): { response: DraftResponse; pieces: DraftPiece[] } {
	const template = getTemplate(input.garment);
	const { unit, bodyMm } = input;
	const checks = checkMeasurements(bodyMm, unit, template.requiredMeasurements, {
		unitConfirmed: input.unitConfirmed
	});
	const resolved = resolveOptions(template, input.optionsMm ?? {}, bodyMm, unit);
	const errors = [...checks.errors, ...resolved.errors];
	const base = {
		garment: template.id,
		name: template.name,
		unit,
		method: template.method,
		sizeBand: sizeBand(bodyMm, template.category),
		warnings: checks.warnings,
		errors
	};
	if (errors.length) {
		const cautions = cautionsFor(bodyMm, []);
		return { response: { ...base, pieces: [], fabric: null, allowances: [], notes: [], cautions }, pieces: [] };
	}

	const draft = template.draft(bodyMm, resolved.options);
	const spec = { ...defaultFabricSpec(unit), ...input.fabric };
	const { estimate: boxes, warnings: fabricWarnings } = estimateFabric(draft.pieces, spec, unit);
	const estimate = boxes && input.nest ? nestFabricEstimate(boxes, draft.pieces, spec, input.nest) : boxes;
	const fabric: FabricOut | null = estimate && {
		width: toUnitValue(estimate.widthMm, unit),
		folded: estimate.folded,
		directional: estimate.directional,
		length: toUnitValue(estimate.lengthMm, unit),
		lengthRounded: estimate.rounded.value,
		buyUnit: estimate.rounded.buyUnit,
		lengthDisplay: estimate.rounded.display,
		efficiency: Math.round(estimate.efficiency * 1000) / 1000,
		svg: layoutSvg(estimate, unit),
		packedLength: toUnitValue(estimate.packedMm, unit),
		shrinkagePercent: estimate.shrinkagePercent,
		roundingAdded: toUnitValue(estimate.rounded.mm - estimate.lengthMm, unit),
		notes: estimate.notes,
		nested: Boolean(estimate.nested),
		lining: estimate.lining ? liningOut(estimate.lining, estimate.widthMm, unit) : null
	};
	const response: DraftResponse = {
		...base,
		pieces: draft.pieces.map((p) => pieceOut(p, unit)),
		fabric,
		allowances: draft.allowances.map((a) => line(a.id, a.label, a.mm, unit)),
		notes: draft.notes,
		cautions: cautionsFor(bodyMm, draft.cautions),
		warnings: [...checks.warnings, ...draft.warnings, ...fabricWarnings]
	};
	return { response, pieces: draft.pieces };
}

/** POST /api/v1/drafts: measurements, length options and fabric in the request's unit. */
/** Errors that mean the numbers themselves cannot be drafted (an API client answers 422 for them). */
export const implausibleCodes: ReadonlySet<Finding['code']> = new Set(['likely_typo', 'unit_mixup']);

export function draftGarment(request: DraftRequest, options: { nest?: NestBudget } = {}): DraftResponse {
	return draftGarmentMm({ ...draftInputFromRequest(request), nest: options.nest });
}

/** A request in its own unit, validated, as the drafting core's millimetre input. */
export function draftInputFromRequest(request: DraftRequest): DraftInputMm {
	const parsed = draftRequestSchema.parse(request);
	const { unit } = parsed;
	const template = getTemplate(parsed.garment);
	const lengthIds = new Set(template.options.filter((o) => o.kind === 'length').map((o) => o.id));
	const bodyMm = Object.fromEntries(
		Object.entries(parsed.measurements).map(([code, value]) => [code, toMm(value, unit)])
	) as Record<MeasurementCode, number>;
	const optionsMm: Record<string, OptionValue> = Object.fromEntries(
		Object.entries(parsed.options).map(([id, value]) => [
			id,
			lengthIds.has(id) && typeof value === 'number' ? toMm(value, unit) : value
		])
	);
	const fabric = parsed.fabric && {
		widthMm: toMm(parsed.fabric.width, unit),
		folded: parsed.fabric.folded,
		directional: parsed.fabric.directional,
		shrinkagePercent: parsed.fabric.shrinkage,
		repeatMm: toMm(parsed.fabric.repeat, unit)
	};
	return { garment: parsed.garment, unit, bodyMm, optionsMm, fabric, unitConfirmed: parsed.unitConfirmed };
}
