import { error, fail, redirect } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import * as quotes from '$lib/server/quotes';
import { amountInputValue } from '$lib/format/amount-input';
import { parseAmount } from '$lib/format/amount-input';
import { quoteWorking } from '$lib/quotes/working';
import type { SessionUser } from '$lib/types/user';
import type { Actions, PageServerLoad } from './$types';

const day = 86_400_000;
const isoDay = (at: Date) => at.toISOString().slice(0, 10);

async function contextFor(db: App.Locals['db'], commissionId: string, user: SessionUser) {
	const context = await quotes.quoteContext(db, { commissionId, tailorId: user.id });
	if (!context) error(404, { message: 'There is no such commission.', code: 'not_found' });
	return context;
}

type Context = Awaited<ReturnType<typeof contextFor>>;

/** The form's starting values: the live quote's terms, or the helper's suggestion for a new one. */
function startingValues({ commission, latest, helper }: Context, now: Date): Record<string, string> {
	const { input, working, leadDays } = helper;
	const figures = {
		fabricMetres: String(input.fabricMetres),
		fabricPrice: amountInputValue(input.fabricPricePerMetreMinor, commission.currency),
		labourHours: String(input.labourHours),
		hourlyRate: input.hourlyRateMinor ? amountInputValue(input.hourlyRateMinor, commission.currency) : '',
		markupPercent: String(input.markupPercent),
		...(input.lining
			? {
					liningMetres: String(input.lining.metres),
					liningPrice: amountInputValue(input.lining.pricePerMetreMinor, commission.currency)
				}
			: {})
	};
	if (latest?.status === 'sent')
		return {
			...figures,
			price: amountInputValue(latest.priceMinor, latest.currency),
			deliveryDate: latest.deliveryDate,
			fittings: String(latest.fittingsIncluded),
			fabricIncluded: latest.fabricIncluded ? 'on' : '',
			advance: latest.advanceMinor > 0 ? amountInputValue(latest.advanceMinor, latest.currency) : '',
			message: latest.message,
			validUntil: isoDay(latest.validUntil)
		};
	const twoWeeks = isoDay(new Date(now.getTime() + 14 * day));
	const closes = commission.expiresAt ? isoDay(commission.expiresAt) : twoWeeks;
	return {
		...figures,
		price: working.totalMinor > 0 ? amountInputValue(working.totalMinor, commission.currency) : '',
		deliveryDate: isoDay(new Date(now.getTime() + leadDays * day)),
		fittings: '1',
		fabricIncluded: commission.fabricSource === 'tailor_sources' ? 'on' : '',
		advance: '',
		message: '',
		validUntil: twoWeeks < closes ? twoWeeks : closes
	};
}

export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = requireRole('tailor');
	const context = await contextFor(locals.db, params.id, user);
	const view = await commissions.getForViewer(locals.db, { id: params.id, viewer: user, unit: user.units });
	if (!view) error(404, { message: 'There is no such commission.', code: 'not_found' });
	const { commission, latest, workroom, helper, mayQuote, bookedDueDates } = context;
	const warnings =
		latest?.status === 'sent'
			? await quotes.quoteWarnings(locals.db, {
					tailorId: user.id,
					deliveryDate: latest.deliveryDate,
					dateNeeded: commission.dateNeeded,
					capacity: workroom?.capacity ?? 1
				})
			: [];
	return {
		commission: {
			id: commission.id,
			title: commission.title,
			status: commission.status,
			currency: commission.currency,
			dateNeeded: commission.dateNeeded,
			expiresAt: commission.expiresAt?.toISOString() ?? null,
			fabricSource: commission.fabricSource,
			garment: view.garment,
			garmentOther: view.garmentOther,
			sizeBandText: view.sizeBandText,
			budget: view.budget
		},
		quote: latest && quotes.quoteJson(latest, warnings),
		mayQuote,
		capacity: workroom?.capacity ?? 1,
		bookedDueDates,
		helperNotes: helper.notes,
		lined: helper.input.lining !== undefined,
		values: startingValues(context, new Date()),
		today: isoDay(new Date()),
		confirmWithdraw: url.searchParams.has('withdraw') && latest?.status === 'sent',
		notice: url.searchParams.has('sent')
			? ('sent' as const)
			: url.searchParams.has('saved')
				? ('saved' as const)
				: url.searchParams.has('withdrawn')
					? ('withdrawn' as const)
					: null
	};
};

/** Maps a refusal onto the form: field issues beside their fields, the rest above the form. */
function refusal(cause: unknown, values: Record<string, string>) {
	if (!(cause instanceof quotes.QuoteError)) throw cause;
	if (cause.code === 'not_found') error(404, { message: cause.message, code: 'not_found' });
	const errors: FieldErrors = {};
	for (const issue of cause.issues) (errors[issue.path] ??= []).push(issue.message);
	if (!cause.issues.length) errors.form = [cause.message];
	return fail(quotes.errorStatus[cause.code], { values, errors });
}

async function readTerms(request: Request, currency: string) {
	const body = await readForm(request);
	if (!body.ok) return { ok: false as const, failure: fail(body.status, { values: body.values, errors: body.errors }) };
	const values = keepValues(body.data, quotes.quoteFormFields);
	const parsed = parseForm(quotes.quoteForm(currency), body.data);
	if (!parsed.ok) return { ok: false as const, failure: fail(400, { values, errors: parsed.errors }) };
	return { ok: true as const, terms: parsed.data, values };
}

const actorOf = (user: SessionUser, ip: string): quotes.Actor => ({ id: user.id, role: user.role, ip });

export const actions: Actions = {
	send: async ({ locals, params, request, getClientAddress }) => {
		const user = requireRole('tailor');
		const { commission } = await contextFor(locals.db, params.id, user);
		const read = await readTerms(request, commission.currency);
		if (!read.ok) return read.failure;
		try {
			await quotes.send(locals.db, {
				commissionId: params.id,
				actor: actorOf(user, getClientAddress()),
				terms: read.terms
			});
		} catch (cause) {
			return refusal(cause, read.values);
		}
		redirect(303, `/commissions/${params.id}/quote?sent=1`);
	},

	edit: async ({ locals, params, request, getClientAddress }) => {
		const user = requireRole('tailor');
		const { commission, latest } = await contextFor(locals.db, params.id, user);
		const read = await readTerms(request, commission.currency);
		if (!read.ok) return read.failure;
		if (latest?.status !== 'sent')
			return fail(409, { values: read.values, errors: { form: ['You have no quote waiting on this commission.'] } });
		try {
			await quotes.edit(locals.db, { id: latest.id, actor: actorOf(user, getClientAddress()), changes: read.terms });
		} catch (cause) {
			return refusal(cause, read.values);
		}
		redirect(303, `/commissions/${params.id}/quote?saved=1`);
	},

	withdraw: async ({ locals, params, getClientAddress }) => {
		const user = requireRole('tailor');
		const { latest } = await contextFor(locals.db, params.id, user);
		if (!latest) error(404, { message: 'There is no such quote.', code: 'not_found' });
		try {
			await quotes.withdraw(locals.db, { id: latest.id, actor: actorOf(user, getClientAddress()) });
		} catch (cause) {
			return refusal(cause, {});
		}
		redirect(303, `/commissions/${params.id}/quote?withdrawn=1`);
	},

	/** Without JavaScript: works the helper out again from the figures sent, optionally taking its total as the price. */
	recalculate: async ({ locals, params, request }) => {
		const user = requireRole('tailor');
		const { commission } = await contextFor(locals.db, params.id, user);
		const body = await readForm(request);
		if (!body.ok) return fail(body.status, { values: body.values, errors: body.errors });
		const values = keepValues(body.data, quotes.quoteFormFields);
		if (body.data.get('useTotal') === '1') {
			const money = (typed: string) => {
				const parsed = parseAmount(typed, commission.currency);
				return parsed.ok ? parsed.minor : 0;
			};
			const working = quoteWorking({
				currency: commission.currency,
				tailorSourcesFabric: commission.fabricSource === 'tailor_sources',
				fabricMetres: Number(values.fabricMetres),
				fabricPricePerMetreMinor: money(values.fabricPrice),
				labourHours: Number(values.labourHours),
				hourlyRateMinor: money(values.hourlyRate),
				markupPercent: Number(values.markupPercent),
				...(values.liningMetres
					? { lining: { metres: Number(values.liningMetres), pricePerMetreMinor: money(values.liningPrice ?? '') } }
					: {})
			});
			values.price = amountInputValue(working.totalMinor, commission.currency);
		}
		return { values, recalculated: true };
	}
};
