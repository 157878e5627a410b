import { z } from 'zod';
import { garmentIds } from '$lib/drafting';
import { text } from '$lib/server/forms';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

// A filter that does not parse is dropped rather than refused: the directory still shows.
const filters = z.object({
	town: text({ min: 1, max: 120 }).optional().catch(undefined),
	garment: z.enum(garmentIds).optional().catch(undefined),
	after: z
		.string()
		.regex(/^[a-z0-9-]{1,80}$/)
		.optional()
		.catch(undefined)
});

export const load: PageServerLoad = async ({ locals, url }) => {
	const { town, garment, after } = filters.parse(Object.fromEntries(url.searchParams));
	const [page, towns] = await Promise.all([
		workrooms.listDirectory(locals.db, { town, specialty: garment, after }),
		workrooms.listTowns(locals.db)
	]);
	return { ...page, towns, filters: { town: town ?? '', garment: garment ?? '' }, paged: Boolean(after) };
};
