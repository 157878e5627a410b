import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { parseForm } from '$lib/server/forms';
import * as mail from '$lib/server/mail';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	requireRole('admin');
	return { deadLetters: await mail.listDeadLetters(locals.db) };
};

const chosen = z.object({ id: z.uuid() });

/** Both buttons name one dead letter; a second click on a handled one is told so. */
function onDeadLetter(act: typeof mail.resendDeadLetter, done: string) {
	return async ({ request, locals }: RequestEvent) => {
		const admin = requireRole('admin');
		const parsed = parseForm(chosen, await request.formData());
		if (!parsed.ok) return fail(400, { errors: { form: ['Choose a mail from the list.'] } });
		const handled = await act(locals.db, { id: parsed.data.id, actorId: admin.id });
		if (!handled) return fail(404, { errors: { form: ['That mail was already sent again or discarded.'] } });
		return { done };
	};
}

export const actions: Actions = {
	resend: onDeadLetter(
		mail.resendDeadLetter,
		'Queued to send again. It leaves the list now and is retried if the relay is still away.'
	),
	discard: onDeadLetter(mail.discardDeadLetter, 'Discarded. It will not be sent.')
};
