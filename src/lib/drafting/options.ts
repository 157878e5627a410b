import type { Finding } from './checks';
import { measurementInfo } from './measurements';
import type {
	BodyMm,
	GarmentTemplate,
	LengthOption,
	OptionSpec,
	OptionValue,
	ResolvedOptions
} from './templates/types';
import { formatLength, type Unit } from './units';

/** Options as given by a caller: lengths already in mm. */
export type GivenOptions = Readonly<Record<string, OptionValue | undefined>>;

export interface ResolvedResult {
	options: ResolvedOptions;
	errors: Finding[];
}

/**
 * A length option's limits as a person working in `unit` sees them. Limits are set in inches where the
 * method is an inch method; in centimetres they become round metric values (common practice): to 0.5 cm
 * under 5 cm, to 1 cm under 30 cm, to 5 cm above; outwards, so the method's own default stays inside. `metricDefaultMm` does the same for the default, which the
 * calculator offers in centimetres (a ⅝ in seam is 1.5 cm, a 7 in zip 18 cm); the API keeps the method's own.
 */
export function optionInUnit<T extends OptionSpec>(spec: T, unit: Unit): T {
	if (spec.kind !== 'length' || unit !== 'cm') return spec;
	const length: LengthOption = spec;
	return { ...spec, minMm: roundMetric(length.minMm, Math.floor), maxMm: roundMetric(length.maxMm, Math.ceil) };
}

export function metricDefaultMm(spec: LengthOption): number | null {
	return spec.defaultMm === null ? null : roundMetric(spec.defaultMm);
}

export function roundMetric(mm: number, round: (x: number) => number = Math.round): number {
	const step = mm < 50 ? 5 : mm < 300 ? 10 : 50;
	return round(mm / step - (round === Math.floor ? -1e-9 : round === Math.ceil ? 1e-9 : 0)) * step;
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
	for (const option of template.options) {
		const spec = optionInUnit(option, unit);
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
