import type { GarmentId, MeasurementCode } from '../measurements';
import { aLineSkirt } from './a-line-skirt';
import { croppedTop } from './cropped-top';
import { shiftDress } from './shift-dress';
import { shirt } from './shirt';
import { straightSkirt } from './straight-skirt';
import { tunic } from './tunic';
import type { GarmentTemplate, OptionSpec } from './types';
import { waistcoat } from './waistcoat';
import { wideLegTrousers } from './wide-leg-trousers';

export const templates: Readonly<Record<GarmentId, GarmentTemplate>> = {
	'wide-leg-trousers': wideLegTrousers,
	'cropped-top': croppedTop,
	'straight-skirt': straightSkirt,
	'a-line-skirt': aLineSkirt,
	'shift-dress': shiftDress,
	tunic,
	shirt,
	waistcoat
};

export interface GarmentSummary {
	id: GarmentId;
	name: string;
	summary: string;
	requiredMeasurements: readonly MeasurementCode[];
	optionalMeasurements: readonly MeasurementCode[];
	options: readonly OptionSpec[];
	defaultLabourHours: number;
}

/** The garments Tackline can draft, in display order. */
export const garments: readonly GarmentSummary[] = Object.values(templates).map((t) => ({
	id: t.id,
	name: t.name,
	summary: t.summary,
	requiredMeasurements: t.requiredMeasurements,
	optionalMeasurements: t.optionalMeasurements,
	options: t.options,
	defaultLabourHours: t.defaultLabourHours
}));

export function getTemplate(id: GarmentId): GarmentTemplate {
	return templates[id];
}

export type { GarmentTemplate, OptionSpec } from './types';
