import type { DraftResponse, GarmentId, MeasurementCode, Measurements, Unit } from '$lib/drafting';
import type { draftGarmentMm } from '$lib/drafting/draft';
import { fabricWidthPresets } from '$lib/drafting/fabric';
import { metricDefaultMm } from '$lib/drafting/options';
import { getTemplate } from '$lib/drafting/templates';
import { formatForInput, parseLength, parseLengths, retypeLengths, toMm } from '$lib/drafting/units';

type Texts = Record<string, string>;
type Drafter = typeof draftGarmentMm;

/**
 * The drafting code (templates' geometry, checks, schemas, nesting) is most of the page's script; it is loaded
 * apart (`load()`) so the page shows and hydrates without waiting for it. Until it arrives there is no draft
 * and nothing to report: what a draft of an empty form shows, before anything is typed.
 */
function notYetDrafted(garment: GarmentId, unit: Unit, name: string): DraftResponse {
	return {
		garment,
		name,
		unit,
		method: '',
		pieces: [],
		fabric: null,
		sizeBand: null,
		allowances: [],
		notes: [],
		cautions: [],
		warnings: [],
		errors: []
	};
}

/** Worked examples: the dressmaker's method in inches for templates 1 and 2, the 88-72-96 body in cm otherwise. */
const examples: Record<GarmentId, { unit: Unit; measurements: Texts; options?: Texts }> = {
	'wide-leg-trousers': {
		unit: 'in',
		measurements: { hip_girth: '40', waist_girth: '28', thigh_girth: '25' },
		options: { length: '45 1/2' }
	},
	'cropped-top': {
		unit: 'in',
		measurements: { bust_girth: '36', shoulder_width: '15', shoulder_to_bust_point: '9 1/2', bust_point_span: '7' },
		options: { length: '18' }
	},
	'straight-skirt': { unit: 'cm', measurements: { waist_girth: '72', hip_girth: '96', waist_to_hip: '20.6' } },
	'a-line-skirt': { unit: 'cm', measurements: { waist_girth: '72', hip_girth: '96', waist_to_hip: '20.6' } },
	'shift-dress': {
		unit: 'cm',
		measurements: {
			bust_girth: '88',
			under_bust_girth: '73',
			waist_girth: '72',
			hip_girth: '96',
			shoulder_width: '38',
			nape_to_waist: '41',
			waist_to_hip: '20.6',
			shoulder_to_bust_point: '25',
			bust_point_span: '18'
		}
	},
	tunic: { unit: 'cm', measurements: { bust_girth: '88', hip_girth: '96', shoulder_width: '38' } },
	shirt: {
		unit: 'cm',
		measurements: {
			bust_girth: '88',
			under_bust_girth: '73',
			waist_girth: '72',
			hip_girth: '96',
			neck_girth: '35',
			shoulder_width: '38',
			nape_to_waist: '41',
			waist_to_hip: '20.6',
			shoulder_to_bust_point: '25',
			bust_point_span: '18',
			upper_arm_girth: '28',
			arm_length: '58'
		}
	},
	waistcoat: {
		unit: 'cm',
		measurements: {
			bust_girth: '88',
			waist_girth: '72',
			hip_girth: '96',
			neck_girth: '35',
			shoulder_width: '38',
			nape_to_waist: '41',
			waist_to_hip: '20.6'
		}
	}
};

/** Everything the draft calculator page knows, computed in the browser from what has been typed. */
export class DraftCalculator {
	garment = $state<GarmentId>('wide-leg-trousers');
	unit = $state<Unit>('cm');
	measurementTexts = $state<Texts>({});
	optionTexts = $state<Texts>({});
	fit = $state('regular');
	switches = $state<Record<string, boolean>>({});
	/** Choice options other than the fit (a waistcoat's button count), as chosen. */
	choices = $state<Record<string, string>>({});
	widthIndex = $state(1);
	folded = $state(true);
	directional = $state(false);
	shrinkage = $state('0');
	repeatText = $state('');
	/** The person has said the numbers are right in this unit (answers a suspected unit mix-up). */
	unitConfirmed = $state(false);

	template = $derived(getTemplate(this.garment));
	fields = $derived<MeasurementCode[]>([...this.template.requiredMeasurements, ...this.template.optionalMeasurements]);
	measurements = $derived(parseLengths(this.measurementTexts, this.unit));
	options = $derived(parseLengths(this.optionTexts, this.unit));
	repeat = $derived(parseLengths({ repeat: this.repeatText }, this.unit));
	widthPresets = $derived(fabricWidthPresets[this.unit]);

	/** In centimetres, empty length options take round metric defaults (1.5 cm, not 1.6 cm for ⅝ in). */
	metricDefaults = $derived.by(() => {
		const defaults: Record<string, number> = {};
		if (this.unit !== 'cm') return defaults;
		for (const spec of this.template.options) {
			const mm = spec.kind === 'length' ? metricDefaultMm(spec) : null;
			if (mm !== null) defaults[spec.id] = mm;
		}
		return defaults;
	});

	/** The drafting function, once `load()` has brought it in. */
	drafter = $state.raw<Drafter | null>(null);
	#loading: Promise<void> | null = null;

	result: DraftResponse = $derived.by(() => {
		const draftGarmentMm = this.drafter;
		if (!draftGarmentMm) return notYetDrafted(this.garment, this.unit, this.template.name);
		const bodyMm: Measurements = {};
		for (const code of this.fields) {
			const value = this.measurements.mm[code];
			if (value !== undefined) bodyMm[code] = value;
		}
		const shrinkage = Number(this.shrinkage.replace(',', '.'));
		return draftGarmentMm({
			garment: this.garment,
			unit: this.unit,
			bodyMm,
			optionsMm: { ...this.metricDefaults, ...this.options.mm, fit: this.fit, ...this.choices, ...this.switches },
			fabric: {
				widthMm: toMm(this.widthPresets[this.widthIndex], this.unit),
				folded: this.folded,
				directional: this.directional,
				shrinkagePercent: Number.isFinite(shrinkage) ? Math.min(Math.max(shrinkage, 0), 20) : 0,
				repeatMm: this.repeat.mm.repeat ?? 0
			},
			unitConfirmed: this.unitConfirmed
		});
	});

	/** The unit the typed numbers look like, when the draft is stopped by a suspected unit mix-up. */
	suggestedUnit = $derived(
		this.unitConfirmed ? undefined : this.result.errors.find((e) => e.code === 'unit_mixup')?.suggestedUnit
	);
	/** A suspected mix-up the person has not answered yet. */
	unitQuestion = $derived(!this.unitConfirmed && this.result.errors.some((e) => e.code === 'unit_mixup'));

	/** How many required measurements are still empty or unreadable. */
	missingCount = $derived(
		this.template.requiredMeasurements.filter((code) => this.measurements.mm[code] === undefined).length
	);

	constructor(garment?: GarmentId, unit?: Unit) {
		if (garment) this.garment = garment;
		if (unit) this.unit = unit;
	}

	/** Bring in the drafting code; the draft follows what is typed from then on. Safe to call more than once. */
	load() {
		this.#loading ??= import('$lib/drafting/draft').then(
			(drafting) => {
				this.drafter = drafting.draftGarmentMm;
			},
			(error: unknown) => {
				this.#loading = null; // a later call tries again
				throw error;
			}
		);
		return this.#loading;
	}

	/** Switch units, rewriting every readable entry in the new unit so nothing changes size. */
	setUnit(next: Unit) {
		if (next === this.unit) return;
		this.measurementTexts = retypeLengths(this.measurementTexts, this.measurements, next);
		this.optionTexts = retypeLengths(this.optionTexts, this.options, next);
		this.repeatText = retypeLengths({ repeat: this.repeatText }, this.repeat, next).repeat;
		this.unit = next;
	}

	/** Keep the numbers as typed and read them in another unit: the one-click answer to a unit mix-up. */
	readAs(next: Unit) {
		this.unit = next;
		this.unitConfirmed = false;
	}

	confirmUnit() {
		this.unitConfirmed = true;
	}

	chooseGarment(next: GarmentId) {
		this.garment = next;
		this.optionTexts = {};
		this.switches = {};
		this.choices = {};
	}

	/** The worked example in the unit and on the cloth already chosen. */
	fillExample() {
		const example = examples[this.garment];
		const inUnit = (texts: Texts = {}) =>
			Object.fromEntries(
				Object.entries(texts).map(([key, text]) => {
					const parsed = parseLength(text, example.unit);
					return [key, parsed.ok && example.unit !== this.unit ? formatForInput(parsed.mm, this.unit) : text];
				})
			);
		this.measurementTexts = inUnit(example.measurements);
		this.optionTexts = inUnit(example.options);
		this.fit = 'regular';
		this.unitConfirmed = false;
	}

	clear() {
		this.measurementTexts = {};
		this.optionTexts = {};
		this.unitConfirmed = false;
	}

	/** Warnings and errors from the draft that name this field. */
	findingsFor(field: string) {
		return {
			errors: this.result.errors.filter((f) => f.fields.includes(field) && f.code !== 'missing_measurements'),
			warnings: this.result.warnings.filter((f) => f.fields.includes(field))
		};
	}
}
