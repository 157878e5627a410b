import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import type { RequestHandler } from './$types';

/** The fitting's calendar file, for the order's two people only. */
export const GET: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const user = requireUser();
	try {
		const file = await fittings.calendarForParty(locals.db, {
			fittingId: params.fittingId,
			orderId: params.id,
			actor: { id: user.id, role: user.role, ip: getClientAddress() }
		});
		return new Response(file.content, {
			headers: {
				'content-type': `text/calendar; charset=utf-8; method=${file.method.toUpperCase()}`,
				'content-disposition': `attachment; filename="fitting-${params.fittingId.slice(0, 8)}.ics"`,
				'cache-control': 'private, no-store'
			}
		});
	} catch (problem) {
		if (problem instanceof fittings.FittingError && problem.code === 'not_found')
			error(404, { message: 'There is no such fitting.', code: 'not_found' });
		throw problem;
	}
};
