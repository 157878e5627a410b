import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { actorOf, answerWith, refused } from '../../respond.server';
import type { RequestHandler } from './$types';

export const POST: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const user = requireRole('customer');
	try {
		await commissions.publish(locals.db, { id: params.id, actor: actorOf(user, getClientAddress()) });
	} catch (error) {
		return refused(error);
	}
	return answerWith(locals.db, user, params.id);
};
