import { json } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import * as notifications from '$lib/server/notifications';
import type { RequestHandler } from './$types';

async function answer(locals: App.Locals, user: { id: string; role: 'customer' | 'tailor' | 'admin' }) {
	return json({ events: await notifications.preferences.list(locals.db, { userId: user.id, role: user.role }) });
}

/** Every event the caller's account can receive, with its mail and in-app settings: `{ events }`. */
export const GET: RequestHandler = async ({ locals }) => {
	const user = requireUser();
	return answer(locals, user);
};

/** Changes the events sent, `{ events: [{ event, email?, inApp? }] }`, and answers the whole grid. */
export const PUT: RequestHandler = async ({ request, locals }) => {
	const user = requireUser();
	const body = await parseJsonBody(request, notifications.schemas.preferencesBody);
	if (!body.ok) return body.response;
	try {
		await notifications.preferences.save(locals.db, { userId: user.id, role: user.role, changes: body.data.events });
	} catch (error) {
		if (error instanceof notifications.PreferenceRefused)
			return apiError(422, 'always_sent', error.message, error.issues);
		throw error;
	}
	return answer(locals, user);
};
