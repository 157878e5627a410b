import { json } from '@sveltejs/kit';
import type { z } from 'zod';
import { BodyError, hasControlCharacters, kilobytes, mediaType, readLimited } from './body';

export type ApiIssue = { path: string; message: string };

/** Answers made by `apiError`, so the error-shape hook knows them without reading their bodies again. */
const shapedErrors = new WeakSet<Response>();

/** True for a response `apiError` made (and that nobody has replaced since). */
export const isShapedError = (response: Response) => shapedErrors.has(response);

/** The one error body every JSON endpoint answers with. */
export function apiError(
	status: number,
	code: string,
	message: string,
	issues: ApiIssue[] = [],
	headers: HeadersInit = {}
) {
	const response = json({ error: { code, message, issues } }, { status, headers });
	shapedErrors.add(response);
	return response;
}

export function zodIssues(error: z.ZodError): ApiIssue[] {
	return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}

export function invalidInput(error: z.ZodError) {
	return apiError(400, 'invalid_input', 'The request has invalid fields.', zodIssues(error));
}

/** Drafting requests are a few kilobytes; anything much larger is not a garment. */
export const defaultJsonLimit = kilobytes(32);

/** Paths of strings carrying control characters (NUL and friends), which no field accepts. */
function controlCharacterIssues(value: unknown, path: string[] = [], found: ApiIssue[] = []): ApiIssue[] {
	if (found.length >= 20) return found;
	if (typeof value === 'string') {
		if (hasControlCharacters(value, { multiline: true }))
			found.push({ path: path.join('.'), message: 'Contains control characters.' });
	} else if (Array.isArray(value)) {
		value.forEach((item, i) => controlCharacterIssues(item, [...path, String(i)], found));
	} else if (value && typeof value === 'object') {
		for (const [key, item] of Object.entries(value)) {
			if (hasControlCharacters(key, { multiline: true }))
				found.push({ path: [...path, key].join('.'), message: 'Contains control characters.' });
			controlCharacterIssues(item, [...path, key], found);
		}
	}
	return found;
}

/**
 * Reads a JSON body: 415 unless it is `application/json`, 413 past `limit` bytes, 400 when it does not
 * parse or carries control characters in any string.
 */
export async function readJson(
	request: Request,
	options: { limit?: number } = {}
): Promise<{ ok: true; body: unknown } | { ok: false; response: Response }> {
	const type = mediaType(request);
	if (type !== 'application/json' && !/^application\/[\w.+-]+\+json$/.test(type)) {
		return {
			ok: false,
			response: apiError(415, 'unsupported_media_type', 'Send the body as JSON with Content-Type: application/json.')
		};
	}
	let raw: Uint8Array<ArrayBuffer>;
	try {
		raw = await readLimited(request, options.limit ?? defaultJsonLimit);
	} catch (error) {
		if (error instanceof BodyError) return { ok: false, response: apiError(error.status, error.code, error.message) };
		throw error;
	}
	let body: unknown;
	try {
		body = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(raw));
	} catch {
		return { ok: false, response: apiError(400, 'invalid_json', 'The request body must be JSON.') };
	}
	const issues = controlCharacterIssues(body);
	if (issues.length)
		return { ok: false, response: apiError(400, 'invalid_input', 'The request has invalid fields.', issues) };
	return { ok: true, body };
}

/** Reads a JSON body and validates it: the parsed data, or the 4xx response to send. */
export async function parseJsonBody<S extends z.ZodType>(
	request: Request,
	schema: S,
	options: { limit?: number } = {}
): Promise<{ ok: true; data: z.output<S> } | { ok: false; response: Response }> {
	const body = await readJson(request, options);
	if (!body.ok) return body;
	const parsed = schema.safeParse(body.body);
	return parsed.success ? { ok: true, data: parsed.data } : { ok: false, response: invalidInput(parsed.error) };
}

/**
 * Reads a query string against a schema: 400 with the usual error body when a parameter carries a control
 * character (which no database text accepts) or the schema refuses it.
 */
export function parseQuery<T extends z.ZodType>(
	url: URL,
	schema: T
): { ok: true; data: z.output<T> } | { ok: false; response: Response } {
	const params = Object.fromEntries(url.searchParams);
	const dirty = Object.entries(params)
		.filter(([key, value]) => hasControlCharacters(key) || hasControlCharacters(value))
		.map(([key]) => ({ path: key, message: 'Contains control characters.' }));
	if (dirty.length)
		return { ok: false, response: apiError(400, 'invalid_input', 'The request has invalid fields.', dirty) };
	const parsed = schema.safeParse(params);
	return parsed.success ? { ok: true, data: parsed.data } : { ok: false, response: invalidInput(parsed.error) };
}
