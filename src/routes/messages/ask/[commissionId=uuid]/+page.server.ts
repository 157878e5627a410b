import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { parseForm, readForm } from '$lib/server/forms';
import * as messages from '$lib/server/messages';
import * as workrooms from '$lib/server/workrooms';
import type { Actions, PageServerLoad } from './$types';

const notFound = { message: 'There is no such open commission.', code: 'not_found' };

/** The question form for one open commission; a tailor who already talks with its customer goes to that thread. */
export const load: PageServerLoad = async ({ params, locals }) => {
	const user = requireRole('tailor');
	const existing = await messages.threadIdFor(locals.db, { commissionId: params.commissionId, tailorId: user.id });
	if (existing) redirect(303, `/messages/${existing}`);
	const commission = await commissions.getForViewer(locals.db, { id: params.commissionId, viewer: user });
	if (!commission || commission.status !== 'open') error(404, notFound);
	return {
		commission: { id: commission.id, title: commission.title },
		canAsk: (await workrooms.getPublic(locals.db, { slugOrId: user.id })) !== null
	};
};

export const actions: Actions = {
	ask: async ({ params, request, locals, getClientAddress }) => {
		const user = requireRole('tailor');
		const form = await readForm(request);
		if (!form.ok) return fail(form.status, { question: true as const, values: { body: '' }, errors: form.errors });
		const body = form.data.get('body');
		const values = { body: typeof body === 'string' ? body : '' };
		const parsed = parseForm(messages.schemas.questionFields, form.data);
		if (!parsed.ok) return fail(400, { question: true as const, values, errors: parsed.errors });
		let threadId: string;
		try {
			({ threadId } = await messages.startQuestion(locals.db, {
				commissionId: params.commissionId,
				actor: { id: user.id, role: user.role, ip: getClientAddress() },
				body: parsed.data.body
			}));
		} catch (caught) {
			if (!(caught instanceof messages.MessageError)) throw caught;
			if (caught.code === 'not_found') error(404, notFound);
			const field = caught.code === 'invalid' ? 'body' : 'form';
			return fail(messages.errorStatus[caught.code], {
				question: true as const,
				values,
				errors: { [field]: [caught.message] }
			});
		}
		redirect(303, `/messages/${threadId}`);
	}
};
