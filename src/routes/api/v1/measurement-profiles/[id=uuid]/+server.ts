import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { clientAddress } from '$lib/server/limits/handle';
import * as profiles from '$lib/server/profiles';
import { patchRequest } from '$lib/server/profiles/schemas';
import { duplicateLabel, profileNotFound as notFound } from '../answers';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals, params }) => {
	const user = requireRole('customer');
	const profile = await profiles.get(locals.db, { ownerId: user.id, id: params.id });
	return profile ? json(profiles.present(profile)) : notFound();
};

export const PATCH: RequestHandler = async (event) => {
	const user = requireRole('customer');
	const parsed = await parseJsonBody(event.request, patchRequest);
	if (!parsed.ok) return parsed.response;
	try {
		const profile = await profiles.update(event.locals.db, {
			ownerId: user.id,
			id: event.params.id,
			ip: clientAddress(event),
			changes: parsed.data
		});
		return profile ? json(profiles.present(profile)) : notFound();
	} catch (cause) {
		if (cause instanceof profiles.DuplicateLabel) return duplicateLabel(cause);
		throw cause;
	}
};

export const DELETE: RequestHandler = async (event) => {
	const user = requireRole('customer');
	const removed = await profiles.remove(event.locals.db, {
		ownerId: user.id,
		id: event.params.id,
		ip: clientAddress(event)
	});
	return removed ? new Response(null, { status: 204 }) : notFound();
};
