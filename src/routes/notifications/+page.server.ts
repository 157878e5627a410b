import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import * as accounts from '$lib/server/accounts';
import { requireUser } from '$lib/server/auth/guard';
import { parseForm, readForm } from '$lib/server/forms';
import * as notifications from '$lib/server/notifications';
import type { Actions, PageServerLoad } from './$types';

const pageSize = 20;
const oneNotice = z.object({ id: z.uuid('Choose a notice.') });

export const load: PageServerLoad = async ({ locals, url, depends }) => {
	depends('notifications:unread');
	const user = requireUser();
	const parsed = notifications.schemas.listQuery.safeParse({ cursor: url.searchParams.get('after') ?? undefined });
	if (!parsed.success) error(400, { message: 'That page of notices does not exist.', code: 'invalid_input' });
	const [page, profile] = await Promise.all([
		notifications.list(locals.db, { userId: user.id, cursor: parsed.data.cursor, limit: pageSize }),
		accounts.getProfile(locals.db, { id: user.id })
	]);
	return { ...page, timeZone: profile?.timeZone ?? 'UTC', paged: Boolean(parsed.data.cursor) };
};

async function readOne(request: Request) {
	const form = await readForm(request);
	if (!form.ok) return { failure: fail(form.status, { errors: form.errors }) };
	const parsed = parseForm(oneNotice, form.data);
	if (!parsed.ok) return { failure: fail(400, { errors: parsed.errors }) };
	return { id: parsed.data.id };
}

export const actions: Actions = {
	/** Marks one notice read and stays on the list. */
	read: async ({ request, locals }) => {
		const user = requireUser();
		const one = await readOne(request);
		if ('failure' in one) return one.failure;
		await notifications.markRead(locals.db, { userId: user.id, ids: [one.id] });
		return { marked: 'one' as const };
	},

	/** Marks one notice read and goes to the page it is about. */
	open: async ({ request, locals }) => {
		const user = requireUser();
		const one = await readOne(request);
		if ('failure' in one) return one.failure;
		const href = await notifications.hrefOf(locals.db, { userId: user.id, id: one.id });
		if (!href) return fail(404, { errors: { form: ['That notice no longer exists.'] } });
		await notifications.markRead(locals.db, { userId: user.id, ids: [one.id] });
		redirect(303, notifications.isInternalPath(href) ? href : '/notifications');
	},

	readAll: async ({ request, locals }) => {
		const user = requireUser();
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { errors: form.errors });
		const marked = await notifications.markRead(locals.db, { userId: user.id, all: true });
		return { marked: 'all' as const, count: marked };
	}
};
