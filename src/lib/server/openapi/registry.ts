import { createDocument, type ZodOpenApiOverride, type ZodOpenApiPathsObject } from 'zod-openapi';
import { sessionCookieName } from '../auth/session-token';

/** One area's part of the API document: its tag (a group on /api/docs) and its operations. */
export interface Area {
	tag: { name: string; description: string };
	paths: ZodOpenApiPathsObject;
}

export type OpenApiDocument = ReturnType<typeof createDocument>;

const methods = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'] as const;

/** Areas may share a path (POST and GET /api/v1/commissions live in two areas); a method may not be claimed twice. */
export function mergePaths(areas: readonly Area[]): ZodOpenApiPathsObject {
	const merged: ZodOpenApiPathsObject = {};
	for (const area of areas) {
		for (const [path, item] of Object.entries(area.paths)) {
			const into = (merged[path] ??= {});
			for (const method of methods) {
				if (!item[method]) continue;
				if (into[method]) throw new Error(`${method.toUpperCase()} ${path} is registered twice.`);
				into[method] = item[method];
			}
		}
	}
	return Object.fromEntries(Object.entries(merged).sort(([a], [b]) => a.localeCompare(b)));
}

/** The OpenAPI 3.1 document for the given areas, rendered from their zod schemas. */
export function buildDocument(areas: readonly Area[], { version }: { version: string }): OpenApiDocument {
	return createDocument(
		{
			openapi: '3.1.0',
			info: {
				title: 'Tackline API',
				version,
				description: [
					'Commission made-to-measure clothes from local tailors.',
					'JSON over HTTPS. Money is in integer minor units beside an ISO 4217 currency code; lengths are in the unit',
					'the request or profile names (`cm` or `in`). Every answer with a status of 400 or more has the body',
					'`{ "error": { "code", "message", "issues" } }`. Requests are limited per client address (429 with',
					'`Retry-After`). Signed-in calls carry the session cookie set by signing in on the site.'
				].join(' ')
			},
			servers: [{ url: '/', description: 'This Tackline site' }],
			tags: areas.map((area) => area.tag),
			components: {
				securitySchemes: {
					session: {
						type: 'apiKey',
						in: 'cookie',
						name: sessionCookieName,
						description: `The session cookie set by signing in (\`__Secure-${sessionCookieName}\` over HTTPS).`
					}
				}
			},
			paths: mergePaths(areas)
		},
		{ override: withoutNoise }
	);
}

const formatsWithPattern = new Set(['uuid', 'date', 'date-time', 'email']);

/** zod spells out the safe-integer range of every `int()` and the regex behind each well-known format. */
const withoutNoise: ZodOpenApiOverride = ({ jsonSchema }) => {
	if (jsonSchema.minimum === Number.MIN_SAFE_INTEGER) delete jsonSchema.minimum;
	if (jsonSchema.maximum === Number.MAX_SAFE_INTEGER) delete jsonSchema.maximum;
	if (jsonSchema.format && formatsWithPattern.has(jsonSchema.format)) delete jsonSchema.pattern;
};
