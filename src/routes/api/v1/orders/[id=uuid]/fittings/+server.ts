import { json } from '@sveltejs/kit';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import { parseJsonBody } from '$lib/server/http/respond';
import { fittingActor, fittingRefused } from '../../../fittings/respond.server';
import type { RequestHandler } from './$types';

/** The order's fittings, for its customer and its tailor, times shown in the caller's zone first. */
export const GET: RequestHandler = async ({ params, locals, getClientAddress }) => {
	const user = requireUser();
	try {
		const page = await fittings.listForOrder(locals.db, {
			orderId: params.id,
			actor: fittingActor(user, getClientAddress())
		});
		return json({ items: page.fittings.map(fittings.fittingJson), cutoffHours: page.cutoffHours });
	} catch (error) {
		return fittingRefused(error);
	}
};

/** The order's tailor offers one to six times: 201 with the new fittings; the customer is told. */
export const POST: RequestHandler = async ({ params, request, locals, getClientAddress }) => {
	const user = requireRole('tailor');
	const parsed = await parseJsonBody(request, fittings.offerRequest);
	if (!parsed.ok) return parsed.response;
	const actor = fittingActor(user, getClientAddress());
	try {
		const rows = await fittings.offer(locals.db, { orderId: params.id, actor, request: parsed.data });
		const page = await fittings.listForOrder(locals.db, { orderId: params.id, actor });
		const made = new Set(rows.map((row) => row.id));
		return json(
			{
				items: page.fittings.filter((view) => made.has(view.id)).map(fittings.fittingJson),
				cutoffHours: page.cutoffHours
			},
			{ status: 201 }
		);
	} catch (error) {
		return fittingRefused(error);
	}
};
