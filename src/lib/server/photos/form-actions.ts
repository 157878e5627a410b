import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { formValue, parseForm, readForm } from '../forms';
import { altTextField, photoErrorMessage, uploadBodyLimit } from './api';

export const photoIdForm = z.object({ photoId: z.uuid() });
export const altTextForm = z.object({ photoId: z.uuid(), altText: altTextField });
export const moveForm = z.object({ photoId: z.uuid(), offset: z.enum(['-1', '1']).transform(Number) });

const chooseFirst = 'Choose at least one photo to upload.';

/** Reads a multipart upload form: its fields and every non-empty file in `file`. */
export async function readUploadForm(request: Request) {
	const form = await readForm(request, { limit: uploadBodyLimit });
	if (!form.ok) return { ok: false as const, failure: fail(form.status, { formError: form.errors.form?.[0] }) };
	const files = form.data.getAll('file').filter((file): file is File => file instanceof File && file.size > 0);
	if (!files.length) return { ok: false as const, failure: fail(400, { formError: chooseFirst }) };
	return { ok: true as const, data: form.data, files };
}

/** Adds each file in turn; the refused ones come back by name with their reasons. */
export async function addEach(
	files: File[],
	add: (file: File) => Promise<unknown>,
	extra: Record<string, string> = {}
) {
	const refused: { name: string; message: string }[] = [];
	for (const file of files) {
		try {
			await add(file);
		} catch (error) {
			refused.push({ name: file.name, message: photoErrorMessage(error).message });
		}
	}
	if (refused.length) return fail(422, { ...extra, refused, uploaded: files.length - refused.length });
	return { ...extra, uploaded: files.length };
}

/** Reads a small photo form, validates it and runs `action`; a broken rule becomes the form's message. */
export async function photoFormAction<S extends z.ZodType>(
	request: Request,
	schema: S,
	action: (data: z.output<S>) => Promise<unknown>
) {
	const form = await readForm(request);
	if (!form.ok) return fail(form.status, { formError: form.errors.form?.[0] });
	// Which portfolio item the form belongs to, so the page shows the answer beside it.
	const itemId = formValue(form.data, 'itemId');
	const parsed = parseForm(schema, form.data);
	if (!parsed.ok) {
		const first = Object.values(parsed.errors).find((messages) => messages?.length)?.[0];
		return fail(400, { itemId, formError: first ?? 'Please check the form.' });
	}
	try {
		await action(parsed.data);
		return { itemId, saved: true };
	} catch (error) {
		const { status, message } = photoErrorMessage(error);
		return fail(status, { itemId, formError: message });
	}
}
