import { fail, type RequestEvent } from '@sveltejs/kit';
import { z } from 'zod';
import * as accounts from '$lib/server/accounts';
import * as audit from '$lib/server/audit';
import { fallbackTimeZone } from '$lib/format/time-zones';
import { requireRole } from '$lib/server/auth/guard';
import { formValue, keepValues, parseForm, readForm, text } from '$lib/server/forms';
import type { Actions, PageServerLoad } from './$types';

const filters = z.object({
	q: text({ max: 100 }).optional().catch(undefined),
	role: z.enum(['customer', 'tailor', 'admin']).optional().catch(undefined),
	after: z
		.string()
		.regex(/^\d{1,15}_[0-9a-f-]{36}$/)
		.transform((value) => {
			const [ms, id] = value.split('_');
			return { createdAt: new Date(Number(ms)), id };
		})
		.refine(({ createdAt, id }) => !Number.isNaN(createdAt.getTime()) && z.uuid().safeParse(id).success)
		.optional()
		.catch(undefined)
});

export const load: PageServerLoad = async ({ url, locals }) => {
	const admin = requireRole('admin');
	const { q, role, after } = filters.parse(Object.fromEntries(url.searchParams));
	const [{ users, next }, profile] = await Promise.all([
		accounts.list(locals.db, { search: q || undefined, role, after }),
		accounts.getProfile(locals.db, { id: admin.id })
	]);
	const histories = await audit.historiesFor(locals.db, { subjectType: 'user', subjectIds: users.map((u) => u.id) });
	return {
		adminId: admin.id,
		timeZone: profile?.timeZone ?? fallbackTimeZone,
		filters: { q: q ?? '', role: role ?? '' },
		users: users.map((u) => ({ ...u, history: histories.get(u.id) ?? [] })),
		nextCursor: next ? `${next.createdAt.getTime()}_${next.id}` : null,
		isFirstPage: !after
	};
};

const suspension = z.object({
	userId: z.uuid(),
	reason: text({
		min: 3,
		max: 500,
		multiline: true,
		tooShort: 'Say briefly why (at least 3 characters).',
		tooLong: 'Keep it under 500 characters.'
	})
});
const oneUser = z.object({ userId: z.uuid() });

/** An admin's one-button action on one account: check the id, do it, say what was done. */
function onOneUser<Done extends string>(
	done: Done,
	act: (db: App.Locals['db'], input: { userId: string; actorId: string }) => Promise<unknown>
) {
	return async ({ request, locals }: RequestEvent) => {
		const admin = requireRole('admin');
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { userId: '', values: form.values, errors: form.errors });
		const parsed = parseForm(oneUser, form.data);
		if (!parsed.ok) return fail(400, { userId: '', values: {}, errors: parsed.errors });
		await act(locals.db, { userId: parsed.data.userId, actorId: admin.id });
		return { userId: parsed.data.userId, done };
	};
}

export const actions: Actions = {
	suspend: async ({ request, locals }) => {
		const admin = requireRole('admin');
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { userId: '', values: form.values, errors: form.errors });
		const formData = form.data;
		const parsed = parseForm(suspension, formData);
		const userId = formValue(formData, 'userId');
		if (!parsed.ok) return fail(400, { userId, values: keepValues(formData, ['reason']), errors: parsed.errors });
		if (parsed.data.userId === admin.id) {
			return fail(400, {
				userId,
				values: keepValues(formData, ['reason']),
				errors: { form: ['You cannot suspend your own account.'] }
			});
		}
		await accounts.suspend(locals.db, { userId: parsed.data.userId, reason: parsed.data.reason, actorId: admin.id });
		return { userId, done: 'suspended' as const };
	},
	reinstate: onOneUser('reinstated', accounts.reinstate),
	endSessions: onOneUser('signed out everywhere', accounts.endAllSessions)
};
