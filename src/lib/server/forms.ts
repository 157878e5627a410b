import { z } from 'zod';
import { BodyError, hasControlCharacters, kilobytes, mediaType, readLimited } from './http/body';

export type FieldErrors = Record<string, string[] | undefined> & { form?: string[] };

export type Parsed<T> = { ok: true; data: T } | { ok: false; errors: FieldErrors };

export const controlCharacterMessage = 'Remove the invisible control characters from this field.';

/** The one builder for free-text fields: trimmed, bounded, and free of control characters. */
export function text(options: { max: number; min?: number; multiline?: boolean; tooShort?: string; tooLong?: string }) {
	const { max, min = 0, multiline = false } = options;
	return z
		.string()
		.trim()
		.refine((value) => !hasControlCharacters(value, { multiline }), controlCharacterMessage)
		.pipe(
			z
				.string()
				.min(min, options.tooShort ?? `Use at least ${min} characters.`)
				.max(max, options.tooLong ?? `Use at most ${max} characters.`)
		)
		.meta({ ...(min > 0 ? { minLength: min } : {}), maxLength: max }); // the limits the API document shows
}

/** Validates submitted form fields; on failure returns messages per field for `fail(400, …)`. */
export function parseForm<S extends z.ZodType>(schema: S, formData: FormData): Parsed<z.output<S>> {
	const fields: Record<string, FormDataEntryValue> = {};
	const refused: FieldErrors = {};
	for (const [key, value] of formData) {
		// Line breaks are fine in a textarea; every other control character is refused before any schema runs.
		if (typeof value === 'string' && hasControlCharacters(value, { multiline: true })) {
			refused[key] = [controlCharacterMessage];
		}
		fields[key] = value;
	}
	if (Object.keys(refused).length) return { ok: false, errors: refused };
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

export type ReadForm =
	| { ok: true; data: FormData }
	| { ok: false; status: 400 | 413 | 415; values: Record<string, string>; errors: FieldErrors };

const formTypes = new Set(['application/x-www-form-urlencoded', 'multipart/form-data']);

/**
 * Every form action reads its body here: a body that is not a web form, is malformed or is larger than
 * `limit` becomes a 4xx with a message for the form, never an exception.
 */
export async function readForm(request: Request, options: { limit?: number } = {}): Promise<ReadForm> {
	const limit = options.limit ?? kilobytes(64);
	const type = mediaType(request);
	try {
		if (!formTypes.has(type)) {
			throw new BodyError(
				415,
				'unsupported_media_type',
				'This form must be sent as a web form (URL-encoded or multipart). Reload the page and try again.'
			);
		}
		const bytes = await readLimited(request, limit);
		const contentType = request.headers.get('content-type') ?? type;
		try {
			return { ok: true, data: await new Response(bytes, { headers: { 'content-type': contentType } }).formData() };
		} catch {
			throw new BodyError(400, 'unreadable_body', 'The form could not be read. Reload the page and try again.');
		}
	} catch (error) {
		if (!(error instanceof BodyError)) throw error;
		return { ok: false, status: error.status, values: {}, errors: { form: [error.message] } };
	}
}
