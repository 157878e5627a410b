import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { keepValues, parseForm, readForm, text } from '$lib/server/forms';
import * as messages from '$lib/server/messages';
import * as orders from '$lib/server/orders';
import * as quotes from '$lib/server/quotes';
import { comparisonSorts, type AcceptPreview } from '$lib/types/quote-comparison';
import { awardedDraftForPage } from './draft.server';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

const sortSchema = z.enum(comparisonSorts).catch('fit');

export const load: PageServerLoad = async ({ locals, params, url, depends, isDataRequest, setHeaders }) => {
	const user = requireUser();
	const view = await commissions.getForViewer(locals.db, { id: params.id, viewer: user, unit: user.units });
	if (!view) error(404, { message: 'There is no such commission.', code: 'not_found' });
	const isParty = view.viewer === 'owner' || view.viewer === 'awarded';
	const isTailor = view.viewer === 'tailor' || view.viewer === 'awarded';
	const draft =
		view.viewer === 'awarded'
			? awardedDraftForPage({ isDataRequest, setHeaders, locals, depends }, view.garment, view.measurements)
			: null;
	const [comparison, order, myQuote, threadId] = await Promise.all([
		view.viewer === 'owner' ? quotes.compare(locals.db, { commissionId: params.id, ownerId: user.id }) : null,
		isParty ? orders.getForParty(locals.db, { viewerId: user.id, commissionId: params.id }) : null,
		isTailor ? quotes.latestQuoteOf(locals.db, { commissionId: view.id, tailorId: user.id }) : null,
		isTailor ? messages.threadIdFor(locals.db, { commissionId: view.id, tailorId: user.id }) : null
	]);
	const asked = url.searchParams.get('accept');
	const confirming = comparison?.quotes.find((q) => q.id === asked && q.status === 'sent');
	const rate = orders.currentFeeBasisPoints();
	const preview: AcceptPreview | null = confirming
		? {
				quoteId: confirming.id,
				...orders.splitPrice(confirming.priceMinor, confirming.currency, rate),
				advanceMinor: confirming.advanceMinor,
				rateText: orders.rateText(rate)
			}
		: null;
	const awardedTo = comparison?.quotes.find((q) => q.status === 'accepted')?.tailor.name ?? null;
	return {
		view,
		myQuote: myQuote && quotes.quoteJson(myQuote),
		threadId,
		comparison,
		order: order && { ...order, rateText: orders.rateText(order.platformFeeBasisPoints) },
		awardedTo,
		draft,
		sort: sortSchema.parse(url.searchParams.get('sort') ?? undefined),
		preview,
		confirmCancel: url.searchParams.has('cancel') && view.viewer === 'owner',
		published: url.searchParams.has('published'),
		saved: url.searchParams.has('saved'),
		accepted: url.searchParams.has('accepted'),
		declined: url.searchParams.has('declined')
	};
};

const acceptForm = z.object({ quoteId: z.string().uuid('Choose a quote from the list.') });
const declineForm = z.object({
	quoteId: z.string().uuid('Choose a quote from the list.'),
	reason: text({ max: quotes.declineReasonMax, multiline: true }).optional().default('')
});

/** A refused decision: 404 for a quote the person may not know; otherwise a failure the page shows. */
function refusedDecision(cause: unknown, quoteId: string, values: Record<string, string> = {}) {
	if (!(cause instanceof quotes.QuoteError)) throw cause;
	if (cause.code === 'not_found') error(404, { message: cause.message, code: 'not_found' });
	return fail(quotes.errorStatus[cause.code], { quoteId, values, errors: { form: [cause.message] } });
}

async function readDecision<S extends z.ZodType>(event: RequestEvent, schema: S) {
	const form = await readForm(event.request);
	if (!form.ok)
		return { ok: false as const, failure: fail(form.status, { quoteId: '', values: {}, errors: form.errors }) };
	const values = keepValues(form.data, ['quoteId', 'reason']);
	const parsed = parseForm(schema, form.data);
	if (!parsed.ok)
		return { ok: false as const, failure: fail(400, { quoteId: values.quoteId, values, errors: parsed.errors }) };
	return { ok: true as const, data: parsed.data, values };
}

export const actions: Actions = {
	cancel: async ({ locals, params, getClientAddress }) => {
		const user = requireRole('customer');
		try {
			await commissions.cancel(locals.db, {
				id: params.id,
				actor: { id: user.id, role: user.role, ip: getClientAddress() }
			});
		} catch (cause) {
			if (!(cause instanceof commissions.CommissionError)) throw cause;
			if (cause.code === 'not_found') error(404, { message: cause.message, code: 'not_found' });
			return fail(409, { errors: { form: [cause.message] } });
		}
		redirect(303, `/commissions/${params.id}`);
	},
	accept: async (event) => {
		const user = requireRole('customer');
		const read = await readDecision(event, acceptForm);
		if (!read.ok) return read.failure;
		try {
			await quotes.accept(event.locals.db, {
				quoteId: read.data.quoteId,
				commissionId: event.params.id,
				actor: { id: user.id, role: user.role, ip: event.getClientAddress() }
			});
		} catch (cause) {
			return refusedDecision(cause, read.data.quoteId);
		}
		redirect(303, `/commissions/${event.params.id}?accepted=1`);
	},
	decline: async (event) => {
		const user = requireRole('customer');
		const read = await readDecision(event, declineForm);
		if (!read.ok) return read.failure;
		try {
			await quotes.decline(event.locals.db, {
				quoteId: read.data.quoteId,
				commissionId: event.params.id,
				actor: { id: user.id, role: user.role, ip: event.getClientAddress() },
				reason: read.data.reason
			});
		} catch (cause) {
			return refusedDecision(cause, read.data.quoteId, read.values);
		}
		redirect(303, `/commissions/${event.params.id}?declined=1#quotes`);
	}
};
