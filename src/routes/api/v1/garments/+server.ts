import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { listGarments, units } from '$lib/drafting';
import { invalidInput } from '$lib/server/http/respond';
import type { RequestHandler } from './$types';

const query = z.object({ unit: z.enum(units).default('cm') });

export const GET: RequestHandler = ({ url }) => {
	const parsed = query.safeParse({ unit: url.searchParams.get('unit') ?? undefined });
	if (!parsed.success) return invalidInput(parsed.error);
	return json(listGarments(parsed.data.unit));
};
