import type { GarmentId, MeasurementCode } from '../measurements';
import type { TemplateDraft } from '../pieces';

export { fits, type Fit } from '../ease';

interface OptionBase {
	id: string;
	label: string;
	help?: string;
}

/** A length option; values are mm here and in the request's unit at the API. */
export interface LengthOption extends OptionBase {
	kind: 'length';
	/** Fixed default, or null when the default comes from a measurement. */
	defaultMm: number | null;
	defaultFrom?: MeasurementCode;
	minMm: number;
	maxMm: number;
}

export interface ChoiceOption extends OptionBase {
	kind: 'choice';
	choices: ReadonlyArray<{ value: string; label: string }>;
	default: string;
}

export interface BooleanOption extends OptionBase {
	kind: 'boolean';
	default: boolean;
}

export type OptionSpec = LengthOption | ChoiceOption | BooleanOption;

export type OptionValue = number | string | boolean;
export type ResolvedOptions = Readonly<Record<string, OptionValue>>;

export type GarmentCategory = 'top' | 'dress' | 'skirt' | 'trousers';

/** Complete measurements for a template: every required code is present (mm). */
export type BodyMm = Readonly<Partial<Record<MeasurementCode, number>>>;

export interface GarmentTemplate {
	id: GarmentId;
	name: string;
	summary: string;
	category: GarmentCategory;
	requiredMeasurements: readonly MeasurementCode[];
	optionalMeasurements: readonly MeasurementCode[];
	options: readonly OptionSpec[];
	defaultLabourHours: number;
	/** Where the method comes from, shown beside the draft. */
	method: string;
	draft(body: BodyMm, options: ResolvedOptions): TemplateDraft;
}
