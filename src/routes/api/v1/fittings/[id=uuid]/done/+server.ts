import { requireRole } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import { changed, fittingActor } from '../../respond.server';
import type { RequestHandler } from './$types';

/** The tailor marks a booked fitting done once it has started. */
export const POST: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const actor = fittingActor(requireRole('tailor'), getClientAddress());
	return changed(locals.db, actor, () => fittings.markDone(locals.db, { fittingId: params.id, actor }));
};
