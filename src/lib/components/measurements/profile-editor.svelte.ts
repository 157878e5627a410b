import type { MeasurementCode, Measurements, Unit } from '$lib/drafting';
import { checkMeasurements } from '$lib/drafting/checks';
import { formatForInput, parseLengths, retypeLengths } from '$lib/drafting/units';

/** The measurement half of the profile form: what is typed, read in the chosen unit, checked as it is typed. */
export class ProfileEditor {
	unit = $state<Unit>('cm');
	texts = $state<Record<string, string>>({});

	parsed = $derived(parseLengths(this.texts, this.unit));
	checks = $derived(checkMeasurements(this.parsed.mm, this.unit));
	filled = $derived(Object.keys(this.parsed.mm).length);

	constructor(unit: Unit, texts: Record<string, string>) {
		this.unit = unit;
		this.texts = texts;
	}

	static fromMm(unit: Unit, valuesMm: Measurements) {
		const texts = Object.fromEntries(Object.entries(valuesMm).map(([code, mm]) => [code, formatForInput(mm, unit)]));
		return new ProfileEditor(unit, texts);
	}

	/** Switch units, rewriting every readable entry so nothing changes size. */
	setUnit(next: Unit) {
		if (next === this.unit) return;
		this.texts = retypeLengths(this.texts, this.parsed, next);
		this.unit = next;
	}

	findingsFor(code: MeasurementCode) {
		return {
			errors: this.checks.errors.filter((f) => f.fields.includes(code)),
			warnings: this.checks.warnings.filter((f) => f.fields.includes(code))
		};
	}
}
