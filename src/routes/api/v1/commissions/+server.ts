import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { parseJsonBody } from '$lib/server/http/respond';
import { actorOf, answerWith, refused, withTownName } from './respond.server';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ request, locals, getClientAddress }) => {
	const user = requireRole('customer');
	const parsed = await parseJsonBody(request, commissions.schemas.apiCreate);
	if (!parsed.ok) return parsed.response;
	const { garmentType, title, ...changes } = await withTownName(
		locals.db,
		commissions.schemas.changesFromApi(parsed.data)
	);
	try {
		const draft = await commissions.createDraft(locals.db, {
			actor: actorOf(user, getClientAddress()),
			changes: { ...changes, garmentType: garmentType!, title: title! }
		});
		return answerWith(locals.db, user, draft.id, 201);
	} catch (error) {
		return refused(error);
	}
};
