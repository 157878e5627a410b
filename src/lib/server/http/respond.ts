import { json } from '@sveltejs/kit';
import type { z } from 'zod';

export type ApiIssue = { path: string; message: string };

/** The one error body every JSON endpoint answers with. */
export function apiError(status: number, code: string, message: string, issues: ApiIssue[] = []) {
	return json({ error: { code, message, issues } }, { status });
}

export function zodIssues(error: z.ZodError): ApiIssue[] {
	return error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message }));
}

export function invalidInput(error: z.ZodError) {
	return apiError(400, 'invalid_input', 'The request has invalid fields.', zodIssues(error));
}

/** Reads a JSON body, answering 400 rather than throwing when it is not JSON. */
export async function readJson(
	request: Request
): Promise<{ ok: true; body: unknown } | { ok: false; response: Response }> {
	try {
		return { ok: true, body: await request.json() };
	} catch {
		return { ok: false, response: apiError(400, 'invalid_json', 'The request body must be JSON.') };
	}
}

/** Reads a JSON body and validates it: the parsed data, or the 400 response to send. */
export async function parseJsonBody<S extends z.ZodType>(
	request: Request,
	schema: S
): Promise<{ ok: true; data: z.output<S> } | { ok: false; response: Response }> {
	const body = await readJson(request);
	if (!body.ok) return body;
	const parsed = schema.safeParse(body.body);
	return parsed.success ? { ok: true, data: parsed.data } : { ok: false, response: invalidInput(parsed.error) };
}
