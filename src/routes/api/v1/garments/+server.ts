import { createHash } from 'node:crypto';
import { garmentsQuerySchema, listGarments, units, type Unit } from '$lib/drafting';
import { invalidInput } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

/** The catalogue lives in code, so each unit's answer is the same for every caller until the next release. */
const answers = new Map(
	units.map((unit: Unit) => {
		const body = JSON.stringify(listGarments(unit));
		return [unit, { body, etag: `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"` }];
	})
);

/** `If-None-Match` may list several tags, weak or strong. */
const matches = (header: string | null, etag: string) =>
	header?.split(',').some((tag) => tag.trim().replace(/^W\//, '') === etag) ?? false;

export const GET: RequestHandler = ({ url, request }) => {
	const parsed = garmentsQuerySchema.safeParse({ unit: url.searchParams.get('unit') ?? undefined });
	if (!parsed.success) return invalidInput(parsed.error);
	const { body, etag } = answers.get(parsed.data.unit)!;
	const headers = { etag, 'cache-control': 'public, max-age=3600' };
	if (matches(request.headers.get('if-none-match'), etag)) return new Response(null, { status: 304, headers });
	return new Response(body, { headers: { ...headers, 'content-type': 'application/json' } });
};
