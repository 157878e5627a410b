import type { Finding } from './checks';
import { measurementInfo } from './measurements';
import type { BodyMm, GarmentTemplate, OptionSpec, OptionValue, ResolvedOptions } from './templates/types';
import { formatLength, type Unit } from './units';

/** Options as given by a caller: lengths already in mm. */
export type GivenOptions = Readonly<Record<string, OptionValue | undefined>>;

export interface ResolvedResult {
	options: ResolvedOptions;
	errors: Finding[];
}

/** Fills defaults (fixed, or taken from a measurement) and refuses values outside each option's range. */
export function resolveOptions(
	template: GarmentTemplate,
	given: GivenOptions,
	body: BodyMm,
	unit: Unit
): ResolvedResult {
	const options: Record<string, OptionValue> = {};
	const errors: Finding[] = [];
	for (const spec of template.options) {
		const value = given[spec.id] ?? defaultOf(spec, body);
		if (value === undefined) {
			errors.push(missingDefault(spec));
			continue;
		}
		const problem = validate(spec, value, unit);
		if (problem) errors.push(problem);
		else options[spec.id] = value;
	}
	return { options, errors };
}

function defaultOf(spec: OptionSpec, body: BodyMm): OptionValue | undefined {
	if (spec.kind !== 'length') return spec.default;
	if (spec.defaultMm !== null) return spec.defaultMm;
	return spec.defaultFrom ? body[spec.defaultFrom] : undefined;
}

function missingDefault(spec: OptionSpec): Finding {
	const from = spec.kind === 'length' && spec.defaultFrom ? spec.defaultFrom : undefined;
	const fields = from ? [`options.${spec.id}`, from] : [`options.${spec.id}`];
	const alternative = from ? ` or the ${measurementInfo[from].label} measurement` : '';
	return { code: 'missing_measurements', fields, message: `Give the ${spec.label.toLowerCase()}${alternative}.` };
}

function validate(spec: OptionSpec, value: OptionValue, unit: Unit): Finding | null {
	const field = [`options.${spec.id}`];
	if (spec.kind === 'length') {
		if (typeof value !== 'number' || !(value >= spec.minMm - 1e-6 && value <= spec.maxMm + 1e-6)) {
			const range = `${formatLength(spec.minMm, unit)}–${formatLength(spec.maxMm, unit, { withUnit: true })}`;
			return { code: 'option_out_of_range', fields: field, message: `${spec.label} must be between ${range}.` };
		}
		return null;
	}
	if (spec.kind === 'choice') {
		if (!spec.choices.some((choice) => choice.value === value)) {
			return {
				code: 'option_out_of_range',
				fields: field,
				message: `${spec.label} must be one of ${spec.choices.map((c) => c.value).join(', ')}.`
			};
		}
		return null;
	}
	return typeof value === 'boolean'
		? null
		: { code: 'option_out_of_range', fields: field, message: `${spec.label} must be yes or no.` };
}
