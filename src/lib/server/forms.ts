import { z } from 'zod';

export type FieldErrors = Record<string, string[] | undefined> & { form?: string[] };

export type Parsed<T> = { ok: true; data: T } | { ok: false; errors: FieldErrors };

/** Validates submitted form fields; on failure returns messages per field for `fail(400, …)`. */
export function parseForm<S extends z.ZodType>(schema: S, formData: FormData): Parsed<z.output<S>> {
	const fields: Record<string, FormDataEntryValue> = {};
	for (const [key, value] of formData) fields[key] = value;
	const result = schema.safeParse(fields);
	if (result.success) return { ok: true, data: result.data };
	const flat = z.flattenError(result.error);
	return { ok: false, errors: { ...flat.fieldErrors, form: flat.formErrors.length ? flat.formErrors : undefined } };
}

/** A submitted text field's value; '' when it is missing or a file. */
export function formValue(formData: FormData, field: string) {
	const value = formData.get(field);
	return typeof value === 'string' ? value : '';
}

/** The submitted text fields, minus secrets, to refill a form after a failure. */
export function keepValues(formData: FormData, fields: string[]) {
	return Object.fromEntries(fields.map((field) => [field, formValue(formData, field)]));
}
