import { requireRole } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import { changed, fittingActor } from '../../respond.server';
import type { RequestHandler } from './$types';

/** The customer books an open time (moving an earlier booking to it); both people are sent the calendar file. */
export const POST: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const actor = fittingActor(requireRole('customer'), getClientAddress());
	return changed(locals.db, actor, () => fittings.book(locals.db, { fittingId: params.id, actor }));
};
