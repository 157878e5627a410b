import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { garmentIds } from '$lib/drafting';
import { maxAltTextLength } from '$lib/types/photos';
import { readForm, text } from '../forms';
import { apiError } from '../http/respond';
import { PhotoRuleBroken } from './errors';
import { PhotoRefused, maxUploadBytes, refusalStatus } from './process';

/** The body limit of an upload: one 15 MB file plus the multipart framing and a few fields. */
export const uploadBodyLimit = maxUploadBytes + 1024 * 1024;

export const altTextField = text({ max: maxAltTextLength });
export const altTextBody = z.object({ altText: altTextField }).strict();
export const portfolioItemBody = z
	.object({
		caption: text({ max: 200 }),
		garmentType: z.enum(garmentIds).nullable().default(null)
	})
	.strict();
export const orderBody = z.object({ order: z.array(z.uuid()).min(1).max(50) }).strict();

const formCodes = { 400: 'unreadable_body', 413: 'body_too_large', 415: 'unsupported_media_type' } as const;

/**
 * The `file` part of a multipart upload (and an optional `altText`), or the 4xx to answer. The file is
 * read as bytes; its name and declared type are ignored, since only the content decides.
 */
export async function readUpload(
	request: Request
): Promise<{ ok: true; file: Blob; altText: string } | { ok: false; response: Response }> {
	const form = await readForm(request, { limit: uploadBodyLimit });
	if (!form.ok) {
		return { ok: false, response: apiError(form.status, formCodes[form.status], form.errors.form?.[0] ?? '') };
	}
	const file = form.data.get('file');
	if (!(file instanceof Blob)) {
		return {
			ok: false,
			response: apiError(400, 'invalid_input', 'Send the photo as multipart/form-data in the field "file".', [
				{ path: 'file', message: 'Required.' }
			])
		};
	}
	const alt = altTextField.safeParse(form.data.get('altText') ?? '');
	if (!alt.success) {
		return {
			ok: false,
			response: apiError(400, 'invalid_input', 'The request has invalid fields.', [
				{ path: 'altText', message: alt.error.issues[0]?.message ?? 'Invalid.' }
			])
		};
	}
	return { ok: true, file, altText: alt.data };
}

/** The answer for a refused upload or a broken photo rule; anything else is rethrown. */
export function photoErrorResponse(error: unknown): Response {
	if (error instanceof PhotoRefused) return apiError(refusalStatus[error.code], error.code, error.message);
	if (error instanceof PhotoRuleBroken) return apiError(error.status, error.code, error.message);
	throw error;
}

/** Runs a photo action and answers with its result as JSON (`status`), or with the matching error. */
export async function answer<T>(action: () => Promise<T>, status = 200): Promise<Response> {
	try {
		const result = await action();
		return status === 204 ? new Response(null, { status }) : json(result, { status });
	} catch (error) {
		return photoErrorResponse(error);
	}
}

/** For form actions: the message to show for a refused upload or broken rule, or rethrows. */
export function photoErrorMessage(error: unknown): { status: number; code: string; message: string } {
	if (error instanceof PhotoRefused)
		return { status: refusalStatus[error.code], code: error.code, message: error.message };
	if (error instanceof PhotoRuleBroken) return { status: error.status, code: error.code, message: error.message };
	throw error;
}
