import { optionInUnit } from './options';
import { garments } from './templates/index';
import type { OptionSpec } from './templates/types';
import { toUnitValue, type Unit } from './units';

/** An option as the API shows it: lengths in the viewer's unit. */
export type OptionOut =
	| {
			id: string;
			label: string;
			kind: 'length';
			unit: Unit;
			default: number | null;
			defaultFrom?: string;
			min: number;
			max: number;
			help?: string;
	  }
	| {
			id: string;
			label: string;
			kind: 'choice';
			default: string;
			choices: Array<{ value: string; label: string }>;
			help?: string;
	  }
	| { id: string; label: string; kind: 'boolean'; default: boolean; help?: string };

function optionOut(spec: OptionSpec, unit: Unit): OptionOut {
	if (spec.kind !== 'length')
		return { ...spec, ...(spec.kind === 'choice' ? { choices: [...spec.choices] } : {}) } as OptionOut;
	const { defaultMm, minMm, maxMm, ...rest } = spec;
	return {
		...rest,
		unit,
		default: defaultMm === null ? null : toUnitValue(defaultMm, unit),
		min: toUnitValue(minMm, unit),
		max: toUnitValue(maxMm, unit)
	};
}

/** GET /api/v1/garments. */
export function listGarments(unit: Unit) {
	return garments.map((g) => ({
		id: g.id,
		name: g.name,
		summary: g.summary,
		requiredMeasurements: [...g.requiredMeasurements],
		optionalMeasurements: [...g.optionalMeasurements],
		options: g.options.map((o) => optionOut(optionInUnit(o, unit), unit)),
		defaultLabourHours: g.defaultLabourHours
	}));
}
