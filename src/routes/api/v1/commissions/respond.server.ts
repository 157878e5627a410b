import { json } from '@sveltejs/kit';
import * as commissions from '$lib/server/commissions';
import { apiError } from '$lib/server/http/respond';
import { placeFromPoint } from '$lib/server/places/form';
import type { SessionUser } from '$lib/types/user';

type View = commissions.CommissionView;

/**
 * The JSON shape of a commission: `measurements` as `{ unit, values }` for the owner and the awarded tailor;
 * nobody else has the key.
 */
export function commissionJson(view: View) {
	if (view.viewer === 'owner' || view.viewer === 'awarded') {
		const { viewer: _viewer, measurements, ...rest } = view;
		return { ...rest, measurements: measurements && { unit: measurements.unit, values: measurements.values } };
	}
	const { viewer: _viewer, ...rest } = view;
	return rest;
}

/** Reads the commission back as the caller sees it and answers with it. */
export async function answerWith(db: App.Locals['db'], user: SessionUser, id: string, status = 200) {
	const view = await commissions.getForViewer(db, { id, viewer: user, unit: user.units });
	if (!view) return apiError(404, 'not_found', 'There is no such commission.');
	return json(commissionJson(view), { status });
}

/** A refused change as the API's error body; anything else is a real failure and is rethrown. */
export function refused(error: unknown) {
	if (!(error instanceof commissions.CommissionError)) throw error;
	return apiError(commissions.errorStatus[error.code], error.code, error.message, error.issues);
}

export function actorOf(user: SessionUser, ip: string): commissions.Actor {
	return { id: user.id, role: user.role, ip };
}

type Changes = ReturnType<typeof commissions.schemas.changesFromApi>;

/** A bare point from an API client is named after the nearest town, as the place picker would. */
export async function withTownName<T extends Changes>(db: App.Locals['db'], changes: T): Promise<T> {
	if (!changes.place || changes.place.city) return changes;
	const found = await placeFromPoint(db, changes.place);
	if (!found.ok) return changes;
	return {
		...changes,
		place: { ...changes.place, city: found.place.name, countryCode: changes.place.countryCode ?? found.place.country }
	};
}
