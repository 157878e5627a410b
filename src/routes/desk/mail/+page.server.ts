import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import { parseForm } from '$lib/server/forms';
import * as mail from '$lib/server/mail';
import type { Actions, PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals }) => {
	requireRole('admin');
	return { deadLetters: await mail.listDeadLetters(locals.db) };
};

const chosen = z.object({ id: z.uuid() });
const notChosen = { errors: { form: ['Choose a mail from the list.'] } };
const goneMessage = 'That mail was already sent again or discarded.';

export const actions: Actions = {
	resend: async ({ request, locals }) => {
		const admin = requireRole('admin');
		const parsed = parseForm(chosen, await request.formData());
		if (!parsed.ok) return fail(400, notChosen);
		const done = await mail.resendDeadLetter(locals.db, { id: parsed.data.id, actorId: admin.id });
		if (!done) return fail(404, { errors: { form: [goneMessage] } });
		return { done: 'Queued to send again. It leaves the list now and is retried if the relay is still away.' };
	},
	discard: async ({ request, locals }) => {
		const admin = requireRole('admin');
		const parsed = parseForm(chosen, await request.formData());
		if (!parsed.ok) return fail(400, notChosen);
		const done = await mail.discardDeadLetter(locals.db, { id: parsed.data.id, actorId: admin.id });
		if (!done) return fail(404, { errors: { form: [goneMessage] } });
		return { done: 'Discarded. It will not be sent.' };
	}
};
