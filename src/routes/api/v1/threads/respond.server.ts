import * as messages from '$lib/server/messages';
import { readForm, parseForm } from '$lib/server/forms';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import { photoErrorResponse, uploadBodyLimit } from '$lib/server/photos/api';
import { mediaType } from '$lib/server/http/body';
import type { SessionUser } from '$lib/types/user';

/** A refused message action (or a refused photo) as the API's error body; anything else is rethrown. */
export function refused(error: unknown): Response {
	if (error instanceof messages.MessageError)
		return apiError(messages.errorStatus[error.code], error.code, error.message, error.issues);
	return photoErrorResponse(error);
}

export function actorOf(user: SessionUser, ip: string): messages.Actor {
	return { id: user.id, role: user.role, ip };
}

const formCodes = { 400: 'unreadable_body', 413: 'body_too_large', 415: 'unsupported_media_type' } as const;

/**
 * A new message's body: JSON `{ body }`, or multipart with `body`, an optional photo in `file` and its
 * `altText`. The answer to send instead when the request is not usable.
 */
export async function readMessage(
	request: Request
): Promise<{ ok: true; body: string; attachments: messages.AttachmentInput[] } | { ok: false; response: Response }> {
	if (mediaType(request) !== 'multipart/form-data') {
		const parsed = await parseJsonBody(request, messages.schemas.postBody);
		return parsed.ok ? { ok: true, body: parsed.data.body, attachments: [] } : parsed;
	}
	const form = await readForm(request, { limit: uploadBodyLimit });
	if (!form.ok)
		return { ok: false, response: apiError(form.status, formCodes[form.status], form.errors.form?.[0] ?? '') };
	const fields = new FormData();
	for (const name of ['body', 'altText']) {
		const value = form.data.get(name);
		if (typeof value === 'string') fields.set(name, value);
	}
	const parsed = parseForm(messages.schemas.sendFields, fields);
	if (!parsed.ok) {
		const issues = Object.entries(parsed.errors).flatMap(([path, list]) =>
			(list ?? []).map((message) => ({ path, message }))
		);
		return { ok: false, response: apiError(400, 'invalid_input', 'The request has invalid fields.', issues) };
	}
	const files = form.data.getAll('file').filter((file): file is File => file instanceof Blob && file.size > 0);
	return {
		ok: true,
		body: parsed.data.body,
		attachments: files.map((file) => ({ file, altText: parsed.data.altText }))
	};
}
