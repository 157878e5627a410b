import { openApi } from '$lib/server/openapi';
import type { RequestHandler } from './$types';

/** `If-None-Match` may list several tags, weak or strong. */
const matches = (header: string | null, etag: string) =>
	header?.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag) ?? false;

/** The OpenAPI 3.1 document, built once from the endpoints' own zod schemas and sent with an ETag. */
export const GET: RequestHandler = ({ request }) => {
	const { body, etag } = openApi();
	const headers = { etag, 'cache-control': 'public, max-age=300' };
	if (matches(request.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });
	return new Response(body, { headers: { ...headers, 'content-type': 'application/json' } });
};
