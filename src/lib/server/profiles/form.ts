import { checkMeasurements, measurementCodes, parseLengths, type CheckResult } from '$lib/drafting';
import { formValue, keepValues, parseForm, type FieldErrors } from '../forms';
import type { ProfileFields } from './index';
import { profileForm } from './schemas';
import { dayStart } from './values';

/** Each measurement's input is named `m.<code>`. */
export const measurementField = (code: string) => `m.${code}`;

export type ProfileFormValues = Record<string, string>;

export type ReadProfileForm =
	| { ok: true; fields: ProfileFields; values: ProfileFormValues }
	| { ok: false; values: ProfileFormValues; errors: FieldErrors; checks?: CheckResult };

const kept = ['label', 'unit', 'takenBy', 'takenAt', 'notes', ...measurementCodes.map(measurementField)];

/** Longer than any body measurement by far: a value past it was not meant as one. */
const maxMm = 10_000;

/**
 * The profile form as typed: lengths read in the chosen unit (fractions and unit suffixes allowed). A
 * check that stops a draft (a value no body has, a unit mix-up, an impossible relation) sends the form
 * back with the findings until the person ticks that the numbers are right.
 */
export function readProfileForm(formData: FormData): ReadProfileForm {
	const values = keepValues(formData, kept);
	const parsed = parseForm(profileForm, formData);
	if (!parsed.ok) return { ok: false, values, errors: parsed.errors };
	const { confirmed, takenAt, ...rest } = parsed.data;
	const texts = Object.fromEntries(measurementCodes.map((code) => [code, formValue(formData, measurementField(code))]));
	const lengths = parseLengths(texts, rest.unit);
	const errors: FieldErrors = {};
	for (const [code, message] of Object.entries(lengths.problems)) errors[measurementField(code)] = [message];
	for (const [code, mm] of Object.entries(lengths.mm)) {
		if (!(mm > 0)) errors[measurementField(code)] = ['Must be more than zero.'];
		else if (mm > maxMm) errors[measurementField(code)] = ['No body measures that much. Check the value and its unit.'];
	}
	if (Object.keys(errors).length) return { ok: false, values, errors };
	const checks = checkMeasurements(lengths.mm, rest.unit);
	if (checks.errors.length && !confirmed) {
		return {
			ok: false,
			values,
			checks,
			errors: { form: ['Some measurements look wrong. Correct them, or tick that they are right and save again.'] }
		};
	}
	return { ok: true, values, fields: { ...rest, valuesMm: lengths.mm, takenAt: dayStart(takenAt) } };
}
