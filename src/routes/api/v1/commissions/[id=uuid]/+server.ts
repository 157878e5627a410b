import { requireRole, requireUser } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import { actorOf, answerWith, refused, withTownName } from '../respond.server';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ params, locals }) => answerWith(locals.db, requireUser(), params.id);

/** A draft saves whatever is sent; an open commission takes the fields that may change while tailors quote. */
export const PATCH: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('customer');
	const parsed = await parseJsonBody(request, commissions.schemas.apiPatch);
	if (!parsed.ok) return parsed.response;
	const own = await commissions.getForOwner(locals.db, { id: params.id, ownerId: user.id });
	if (!own) return apiError(404, 'not_found', 'There is no such commission.');
	const input = {
		id: params.id,
		actor: actorOf(user, getClientAddress()),
		changes: await withTownName(locals.db, commissions.schemas.changesFromApi(parsed.data))
	};
	try {
		if (own.status === 'open') await commissions.editOpen(locals.db, input);
		else await commissions.updateDraft(locals.db, input);
	} catch (error) {
		return refused(error);
	}
	return answerWith(locals.db, user, params.id);
};
