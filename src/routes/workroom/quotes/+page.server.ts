import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import * as quotes from '$lib/server/quotes';
import type { PageServerLoad } from './$types';

const statuses = ['sent', 'accepted', 'declined', 'withdrawn', 'lapsed'] as const;

/** Unknown filters and damaged cursors read as "all, from the start" rather than as an error page. */
const query = z.object({
	status: z.enum(statuses).optional().catch(undefined),
	cursor: z.string().max(80).optional().catch(undefined)
});

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('tailor');
	const { status, cursor } = query.parse(Object.fromEntries(url.searchParams));
	const page = await quotes.listOwn(locals.db, { tailorId: user.id, status, cursor });
	return { ...page, status: status ?? null, statuses, paged: Boolean(cursor) };
};
