import { error, fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole, requireUser } from '$lib/server/auth/guard';
import * as fittings from '$lib/server/fittings';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import type { SessionUser } from '$lib/types/user';
import type { Actions, PageServerLoad } from './$types';

const offerFields = [
	'timeZone',
	'durationMinutes',
	'placeKind',
	'address',
	'notes',
	...fittings.formRows.flatMap((i) => [`date_${i}`, `time_${i}`])
];

const fittingField = z.object({ fittingId: z.uuid() });

function actorOf(user: SessionUser, ip: string): fittings.Actor {
	return { id: user.id, role: user.role, ip };
}

function notFound(): never {
	error(404, { message: 'There is no such order.', code: 'not_found' });
}

export const load: PageServerLoad = async ({ params, locals, url, getClientAddress }) => {
	const user = requireUser();
	let page: fittings.FittingsPage;
	try {
		page = await fittings.listForOrder(locals.db, { orderId: params.id, actor: actorOf(user, getClientAddress()) });
	} catch (problem) {
		if (problem instanceof fittings.FittingError && problem.code === 'not_found') notFound();
		throw problem;
	}
	// A confirmation step before what cannot be undone: `?cancel=<id>` or `?move=<id>`.
	// Only while the step still applies: after the change, the same address shows the outcome instead.
	const confirm = (name: string, applies: (f: fittings.FittingView) => boolean) => {
		const id = url.searchParams.get(name);
		return page.fittings.find((f) => f.id === id && applies(f)) ?? null;
	};
	return {
		page,
		confirmCancel: confirm('cancel', (f) => f.can.cancel || f.can.withdraw || f.can.cancelBooking),
		confirmMove: confirm('move', (f) => f.can.book),
		durations: [15, 30, 45, 60, 90, 120, 180]
	};
};

function changeFailure(status: number, fittingId: string, message: string, reason?: string) {
	return fail(status, { change: { fittingId, message, errors: { reason } } });
}

/** A refused change as a form failure the page shows beside the fitting it was about. */
function refused(problem: unknown, fittingId: string) {
	if (!(problem instanceof fittings.FittingError)) throw problem;
	if (problem.code === 'not_found') notFound();
	const reason = problem.issues.find((i) => i.path === 'reason')?.message;
	return changeFailure(fittings.errorStatus[problem.code], fittingId, problem.message, reason);
}

async function readFittingForm(request: Request) {
	const body = await readForm(request);
	if (!body.ok) return { failure: changeFailure(body.status, '', body.errors.form?.[0] ?? '') };
	const parsed = parseForm(fittingField, body.data);
	if (!parsed.ok) notFound();
	return { data: body.data, fittingId: parsed.data.fittingId };
}

export const actions: Actions = {
	/** The tailor offers up to six times. */
	offer: async ({ params, request, locals, getClientAddress }) => {
		const user = requireRole('tailor');
		const body = await readForm(request);
		if (!body.ok) return fail(body.status, { offer: { values: body.values, errors: body.errors } });
		const values = keepValues(body.data, offerFields);
		const parsed = parseForm(fittings.offerForm, body.data);
		if (!parsed.ok) return fail(400, { offer: { values, errors: parsed.errors } });
		const { request: offerRequest, rows } = fittings.offerFromForm(parsed.data);
		try {
			const made = await fittings.offer(locals.db, {
				orderId: params.id,
				actor: actorOf(user, getClientAddress()),
				request: offerRequest
			});
			return { offered: made.length };
		} catch (problem) {
			if (!(problem instanceof fittings.FittingError)) throw problem;
			if (problem.code === 'not_found') notFound();
			const errors: FieldErrors = { form: [problem.message] };
			for (const issue of problem.issues) {
				const slot = /^slots\.(\d+)\.start$/.exec(issue.path);
				const field = slot ? `date_${rows[Number(slot[1])]}` : issue.path;
				errors[field] = [...(errors[field] ?? []), issue.message];
			}
			return fail(fittings.errorStatus[problem.code], { offer: { values, errors } });
		}
	},

	/** The customer books an open time, or moves their booking to it. */
	book: async ({ request, locals, getClientAddress }) => {
		const user = requireRole('customer');
		const form = await readFittingForm(request);
		if (form.failure) return form.failure;
		try {
			await fittings.book(locals.db, { fittingId: form.fittingId, actor: actorOf(user, getClientAddress()) });
			return { booked: form.fittingId };
		} catch (problem) {
			return refused(problem, form.fittingId);
		}
	},

	/** The customer cancels their booking; the tailor withdraws an open time or cancels a booking with a reason. */
	cancel: async ({ request, locals, getClientAddress }) => {
		const user = requireRole('customer', 'tailor');
		const form = await readFittingForm(request);
		if (form.failure) return form.failure;
		const parsed = parseForm(fittings.cancelForm, form.data);
		if (!parsed.ok) return changeFailure(400, form.fittingId, 'Check the reason.', parsed.errors.reason?.[0]);
		try {
			await fittings.cancel(locals.db, {
				fittingId: form.fittingId,
				actor: actorOf(user, getClientAddress()),
				request: { reason: parsed.data.reason }
			});
			return { cancelled: form.fittingId };
		} catch (problem) {
			return refused(problem, form.fittingId);
		}
	},

	/** The tailor marks a fitting that has started as done. */
	done: async ({ request, locals, getClientAddress }) => {
		const user = requireRole('tailor');
		const form = await readFittingForm(request);
		if (form.failure) return form.failure;
		try {
			await fittings.markDone(locals.db, { fittingId: form.fittingId, actor: actorOf(user, getClientAddress()) });
			return { done: form.fittingId };
		} catch (problem) {
			return refused(problem, form.fittingId);
		}
	}
};
