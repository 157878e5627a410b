import { z } from 'zod';
import { measurementCodes, measurementsSchema, units, type MeasurementCode } from '$lib/drafting';
import { text } from '../forms';
import { measurementTaker } from '../db/schema';
import { dayStart, toMmValues } from './values';

export const takers = measurementTaker.enumValues;

export const label = text({
	min: 1,
	max: 60,
	tooShort: 'Give the profile a name, like “Me” or “My son”.',
	tooLong: 'Keep the name to 60 characters.'
});
export const notes = text({ max: 1000, multiline: true, tooLong: 'Keep the notes to 1000 characters.' });
export const unit = z.enum(units, { error: 'Choose centimetres or inches.' });
export const takenBy = z.enum(takers, { error: 'Say who took the measurements.' });

/** The day the measurements were taken, `YYYY-MM-DD`: not in the future (a day's grace for time zones). */
export const takenOn = z.iso.date({ error: 'Give the date as YYYY-MM-DD.' }).refine((day) => {
	const at = Date.parse(`${day}T00:00:00Z`);
	return at <= Date.now() + 86_400_000 && at >= Date.parse('1900-01-01T00:00:00Z');
}, 'Give the day they were taken; it cannot be in the future.');

const unknownCodeMessage = `Not a measurement code; use one of ${measurementCodes.join(', ')}.`;

/** Values keyed by measurement code, in the request's unit; unknown codes are named one by one. */
function values<V extends z.ZodType>(value: V) {
	return z.record(z.string(), value).superRefine((record, ctx) => {
		for (const key of Object.keys(record)) {
			if (!(measurementCodes as readonly string[]).includes(key))
				ctx.addIssue({ code: 'custom', path: [key], message: unknownCodeMessage });
		}
	}) as unknown as z.ZodType<Partial<Record<MeasurementCode, z.output<V>>>>;
}

const positiveLength = measurementsSchema.valueType;

/** `POST /api/v1/measurement-profiles`, read into the profile's stored fields (millimetres). */
export const createRequest = z
	.object({
		label,
		unit,
		values: values(positiveLength).default({}),
		takenBy: takenBy.default('self'),
		takenAt: takenOn.nullable().default(null),
		notes: notes.default('')
	})
	.strict()
	.transform(({ values, takenAt, ...fields }) => ({
		...fields,
		valuesMm: toMmValues(values, fields.unit),
		takenAt: dayStart(takenAt)
	}));
export type CreateRequest = z.output<typeof createRequest>;

/** `PATCH /api/v1/measurement-profiles/{id}`: every field optional; in `values`, null removes a measurement. */
export const patchRequest = z
	.object({
		label,
		unit,
		values: values(positiveLength.nullable()),
		takenBy,
		takenAt: takenOn.nullable(),
		notes
	})
	.partial()
	.strict()
	.transform(({ values, takenAt, ...fields }) => ({
		...fields,
		...(takenAt !== undefined ? { takenAt: dayStart(takenAt) } : {}),
		...(values ? { valuesPatch: values } : {})
	}));
export type PatchRequest = z.output<typeof patchRequest>;

/** The profile form's own fields; the measurements are read beside it (`m.<code>`). */
export const profileForm = z.object({
	label,
	unit,
	takenBy,
	takenAt: z.union([z.literal(''), takenOn]).transform((day) => day || null),
	notes,
	confirmed: z
		.string()
		.optional()
		.transform((value) => value === 'yes')
});

export const renameForm = z.object({ id: z.uuid({ error: 'Choose a profile.' }), label });
export const deleteForm = z.object({ id: z.uuid({ error: 'Choose a profile.' }) });
