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
