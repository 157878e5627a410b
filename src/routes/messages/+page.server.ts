import { error } from '@sveltejs/kit';
import * as accounts from '$lib/server/accounts';
import { requireUser } from '$lib/server/auth/guard';
import * as messages from '$lib/server/messages';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, url }) => {
	const user = requireUser();
	const parsed = messages.schemas.threadsQuery.safeParse({ cursor: url.searchParams.get('after') ?? undefined });
	if (!parsed.success) error(400, { message: 'That page of conversations does not exist.', code: 'invalid_input' });
	const [page, profile] = await Promise.all([
		messages.threadsFor(locals.db, { viewer: user, ...parsed.data }),
		accounts.getProfile(locals.db, { id: user.id })
	]);
	return { ...page, role: user.role, timeZone: profile?.timeZone ?? 'UTC', paged: Boolean(parsed.data.cursor) };
};
