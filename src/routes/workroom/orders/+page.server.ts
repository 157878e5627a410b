import { z } from 'zod';
import * as accounts from '$lib/server/accounts';
import { requireRole } from '$lib/server/auth/guard';
import { todayIn } from '$lib/server/commissions';
import { boardFor } from '$lib/server/orders/board';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

/** A damaged cursor reads as "the first page of finished orders". */
const query = z.object({ finished: z.string().max(200).optional().catch(undefined) });

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireRole('tailor');
	const { finished } = query.parse(Object.fromEntries(url.searchParams));
	const [profile, workroom] = await Promise.all([
		accounts.getProfile(locals.db, { id: user.id }),
		workrooms.getOwn(locals.db, { tailorId: user.id })
	]);
	// Overdue and "this week" are counted in the workroom's own days.
	const today = todayIn(profile?.timeZone ?? 'UTC');
	const board = await boardFor(locals.db, { tailorId: user.id, today, finishedCursor: finished });
	return { ...board, today, capacity: workroom?.capacity ?? null, pagedFinished: Boolean(finished) };
};
