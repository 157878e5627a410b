import { z } from 'zod';
import type {
	ZodOpenApiOperationObject,
	ZodOpenApiParameters,
	ZodOpenApiPathsObject,
	ZodOpenApiResponsesObject
} from 'zod-openapi';
import type { Role } from '$lib/types/user';

export type { ZodOpenApiPathsObject as Paths };

/** One problem with one field of the request: `path` is dotted (`budget.minMinor`), empty for the whole body. */
export const apiIssueSchema = z
	.object({ path: z.string(), message: z.string() })
	.meta({ id: 'ApiIssue', description: 'One problem with one field of the request.' });

/** `{ error: { code, message, issues } }`: every answer under /api with a status of 400 or more. */
export const apiErrorSchema = z
	.object({
		error: z.object({
			code: z.string().meta({ description: 'Stable, machine-readable: `invalid_input`, `not_found`, …' }),
			message: z.string().meta({ description: 'A sentence a person can read.' }),
			issues: z.array(apiIssueSchema)
		})
	})
	.meta({ id: 'ApiError', description: 'The one error body every endpoint answers with.' });

const statusText: Record<ErrorStatus, string> = {
	400: 'Bad input: the body or query does not parse, or a field is refused (`invalid_input` names each in `issues`).',
	401: 'Not signed in (or the account is suspended).',
	403: 'Signed in with a role that may not do this.',
	404: 'No such thing, or it is not yours to see (the answer is the same either way).',
	409: 'The thing is not in a state that allows this any more.',
	413: 'The body is larger than this endpoint accepts.',
	415: 'The body is not of the media type this endpoint reads.',
	422: 'Understood, but refused by a rule of the domain (`issues` says which).',
	429: 'Too many requests from this address; `Retry-After` says when to try again.',
	503: 'Busy or briefly unavailable; try again shortly.'
};
export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503;

/** The error answers of an operation, each with the shared error body. 429 applies to all of `/api/v1`. */
export function errors(...statuses: ErrorStatus[]): ZodOpenApiResponsesObject {
	const all = [...new Set<ErrorStatus>([...statuses, 429])].sort((a, b) => a - b);
	return Object.fromEntries(
		all.map((status) => [
			String(status),
			{
				description: statusText[status],
				content: { 'application/json': { schema: apiErrorSchema } },
				...(status === 429
					? { headers: { 'retry-after': { description: 'Seconds to wait.', schema: { type: 'integer' as const } } } }
					: {})
			}
		])
	);
}

/** A JSON answer. */
export function jsonBody(schema: z.ZodType, description: string) {
	return { description, content: { 'application/json': { schema } } };
}

/** A JSON request body (sent with `Content-Type: application/json`). */
export function jsonRequest(schema: z.ZodType, description?: string) {
	return { required: true, ...(description ? { description } : {}), content: { 'application/json': { schema } } };
}

/** A path segment holding a uuid. */
export function uuidPath(...names: string[]): ZodOpenApiParameters {
	return { path: z.object(Object.fromEntries(names.map((name) => [name, z.uuid()]))) };
}

export const sessionSecurity = [{ session: [] }];

const roleNames: Record<Role, string> = { customer: 'customers', tailor: 'tailors', admin: 'administrators' };

/**
 * Who may call an operation, as its `security` and the sentence that opens its description. `public`
 * needs no session; `signedIn` any signed-in role; otherwise the roles named.
 */
export function access(
	who: 'public' | 'signedIn' | Role[],
	description: string
): Pick<ZodOpenApiOperationObject, 'security' | 'description'> {
	if (who === 'public') return { security: [], description: `Public: no session needed. ${description}` };
	const sentence =
		who === 'signedIn'
			? 'Needs a signed-in session (any role).'
			: `Needs a signed-in session; ${who.map((r) => roleNames[r]).join(' and ')} only.`;
	return { security: sessionSecurity, description: `${sentence} ${description}` };
}

/** A photo upload: one image as the multipart field `file`, with optional alt text. */
export function photoUpload(altTextDescription: string) {
	return {
		required: true,
		content: {
			'multipart/form-data': {
				schema: z.object({
					file: z.string().meta({
						description: 'The image (JPEG, PNG or WebP; up to 15 MB). Its content decides, never its name.',
						override: { type: 'string', contentMediaType: 'application/octet-stream' }
					}),
					altText: z.string().optional().meta({ description: altTextDescription })
				})
			}
		}
	};
}
