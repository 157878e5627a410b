import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { parseJsonBody } from '$lib/server/http/respond';
import { clientAddress } from '$lib/server/limits/handle';
import * as profiles from '$lib/server/profiles';
import { createRequest } from '$lib/server/profiles/schemas';
import { duplicateLabel } from './answers';
import type { RequestHandler } from './$types';

export const GET: RequestHandler = async ({ locals }) => {
	const user = requireRole('customer');
	const items = await profiles.list(locals.db, { ownerId: user.id });
	return json({ items: items.map(profiles.present) });
};

export const POST: RequestHandler = async (event) => {
	const user = requireRole('customer');
	const parsed = await parseJsonBody(event.request, createRequest);
	if (!parsed.ok) return parsed.response;
	try {
		const profile = await profiles.create(event.locals.db, {
			ownerId: user.id,
			ip: clientAddress(event),
			fields: parsed.data
		});
		return json(profiles.present(profile), {
			status: 201,
			headers: { location: `${event.url.pathname}/${profile.id}` }
		});
	} catch (cause) {
		if (cause instanceof profiles.DuplicateLabel) return duplicateLabel(cause);
		throw cause;
	}
};
