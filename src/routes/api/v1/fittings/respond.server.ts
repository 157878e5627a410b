import { json } from '@sveltejs/kit';
import * as fittings from '$lib/server/fittings';
import { apiError } from '$lib/server/http/respond';
import type { SessionUser } from '$lib/types/user';

/** A refused fitting change as the API's error body; anything else is a real failure and is rethrown. */
export function fittingRefused(error: unknown) {
	if (!(error instanceof fittings.FittingError)) throw error;
	return apiError(fittings.errorStatus[error.code], error.code, error.message, error.issues);
}

export function fittingActor(user: SessionUser, ip: string): fittings.Actor {
	return { id: user.id, role: user.role, ip };
}

/** Runs one change and answers the fitting as the caller now sees it. */
export async function changed(
	db: App.Locals['db'],
	actor: fittings.Actor,
	change: () => Promise<{ id: string }>
): Promise<Response> {
	try {
		const row = await change();
		return json(fittings.fittingJson(await fittings.getForParty(db, { fittingId: row.id, actor })));
	} catch (error) {
		return fittingRefused(error);
	}
}
