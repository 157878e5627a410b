import { error, fail } from '@sveltejs/kit';
import * as accounts from '$lib/server/accounts';
import { requireUser } from '$lib/server/auth/guard';
import { parseForm, readForm } from '$lib/server/forms';
import * as messages from '$lib/server/messages';
import { photoErrorMessage, uploadBodyLimit } from '$lib/server/photos/api';
import type { MessageView } from '$lib/types/messages';
import type { Actions, PageServerLoad } from './$types';

const notFound = { message: 'There is no such conversation.', code: 'not_found' };

async function orNotFound<T>(work: Promise<T>): Promise<T> {
	try {
		return await work;
	} catch (caught) {
		if (caught instanceof messages.MessageError && caught.code === 'not_found') error(404, notFound);
		throw caught;
	}
}

/** The conversation (newest page, or an older one with `?before=`); opening it marks what it shows as read. */
export const load: PageServerLoad = async ({ params, locals, url }) => {
	const user = requireUser();
	const before = messages.schemas.messagesQuery.safeParse({ cursor: url.searchParams.get('before') ?? undefined });
	if (!before.success) error(404, notFound);
	const thread = await orNotFound(messages.getThread(locals.db, { threadId: params.id, viewer: user }));
	const [page, profile] = await Promise.all([
		messages.list(locals.db, { threadId: params.id, viewer: user, cursor: before.data.cursor }),
		accounts.getProfile(locals.db, { id: user.id }),
		messages.markRead(locals.db, { threadId: params.id, viewer: user })
	]);
	return {
		thread,
		messages: page.items.toReversed(),
		olderCursor: page.nextCursor,
		paged: Boolean(before.data.cursor),
		timeZone: profile?.timeZone ?? 'UTC'
	};
};

type SendFailure = { values: { body: string; altText: string }; errors: Record<string, string[] | undefined> };

export const actions: Actions = {
	/** Sends a message (and a photo, when one is chosen); the page shows it at once, and the other side live. */
	send: async ({ params, request, locals, getClientAddress }) => {
		const user = requireUser();
		const form = await readForm(request, { limit: uploadBodyLimit });
		if (!form.ok)
			return fail(form.status, { values: { body: '', altText: '' }, errors: form.errors } satisfies SendFailure);
		const text = (name: string) => {
			const value = form.data.get(name);
			return typeof value === 'string' ? value : '';
		};
		const values = { body: text('body'), altText: text('altText') };
		const fields = new FormData();
		fields.set('body', values.body);
		fields.set('altText', values.altText);
		const parsed = parseForm(messages.schemas.sendFields, fields);
		if (!parsed.ok) return fail(400, { values, errors: parsed.errors } satisfies SendFailure);
		const files = form.data.getAll('file').filter((file): file is File => file instanceof Blob && file.size > 0);
		try {
			const sent: MessageView = await messages.post(locals.db, {
				threadId: params.id,
				actor: { id: user.id, role: user.role, ip: getClientAddress() },
				body: parsed.data.body,
				attachments: files.map((file) => ({ file, altText: parsed.data.altText }))
			});
			return { sent };
		} catch (caught) {
			if (caught instanceof messages.MessageError) {
				if (caught.code === 'not_found') error(404, notFound);
				const field = caught.issues[0]?.path === 'file' ? 'file' : caught.code === 'invalid' ? 'body' : 'form';
				return fail(messages.errorStatus[caught.code], {
					values,
					errors: { [field]: [caught.message] }
				} satisfies SendFailure);
			}
			const refused = photoErrorMessage(caught);
			return fail(refused.status, { values, errors: { file: [refused.message] } } satisfies SendFailure);
		}
	}
};
