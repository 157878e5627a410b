import { error, fail, redirect, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { nextStep, previousStep, stepHref, type CommissionStepId } from '$lib/components/commissions/steps';
import { requireRole } from '$lib/server/auth/guard';
import * as commissions from '$lib/server/commissions';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import { commissionPhotos } from '$lib/server/photos';

type DraftChanges = Parameters<typeof commissions.updateDraft>[1]['changes'];

/** The steps already filled in, for the step navigation's ticks. */
function doneSteps(c: NonNullable<Awaited<ReturnType<typeof commissions.getForOwner>>>, photoCount = 0) {
	const done: CommissionStepId[] = [];
	if (c.title && c.garmentType) done.push('garment');
	if (photoCount > 0) done.push('photos');
	if (c.measurementProfileId) done.push('measurements');
	if (c.fabricNotes || c.budgetMaxMinor !== null || c.city) done.push('fabric');
	if (c.budgetMaxMinor !== null && c.dateNeeded) done.push('budget');
	if (c.city) done.push('place');
	return done;
}

/** The owner's draft (or open commission) behind a step page; 404 for anything else. */
export async function loadStep(locals: App.Locals, id: string) {
	const user = requireRole('customer');
	const commission = await commissions.getForOwner(locals.db, { id, ownerId: user.id });
	if (!commission || (commission.status !== 'draft' && commission.status !== 'open'))
		error(404, { message: 'There is no such commission to edit.', code: 'not_found' });
	const photoCount = await commissionPhotos.photoCount(locals.db, { commissionId: id });
	return { commission, done: doneSteps(commission, photoCount), isOpen: commission.status === 'open' };
}

/** Where a saved step goes: on, back, to the list ("finish later"), or back to the page of an open commission. */
function destination(id: string, step: CommissionStepId, then: string | null, isOpen: boolean) {
	if (isOpen) return `/commissions/${id}?saved=1`;
	if (then === 'later') return '/commissions?saved=1';
	const target = then === 'back' ? previousStep(step) : nextStep(step);
	return stepHref(id, target ?? step);
}

const issueField: Record<string, string> = { budget: 'budgetMin', measurements: 'measurementProfileId' };

function issuesAsErrors(issues: commissions.CommissionIssue[], message: string): FieldErrors {
	const errors: FieldErrors = {};
	for (const issue of issues) (errors[issueField[issue.path] ?? issue.path] ??= []).push(issue.message);
	if (issues.length === 0) errors.form = [message];
	return errors;
}

/**
 * Saves one step: the form is parsed with the step's schema, the draft (or the open commission) is changed
 * through the domain, and the person moves on. On any refusal the page is shown again with what they typed.
 */
export async function saveStep<S extends z.ZodType>(
	event: RequestEvent<{ id: string }>,
	{
		step,
		schema,
		fields,
		toChanges
	}: {
		step: CommissionStepId;
		schema: S;
		fields: string[];
		toChanges: (data: z.output<S>, db: App.Locals['db']) => DraftChanges | Promise<DraftChanges>;
	}
) {
	const user = requireRole('customer');
	const { locals, params } = event;
	const form = await readForm(event.request);
	if (!form.ok) return fail(form.status, { values: form.values, errors: form.errors });
	const values = keepValues(form.data, fields);
	const then = form.data.get('then');
	const own = await commissions.getForOwner(locals.db, { id: params.id, ownerId: user.id });
	if (!own || (own.status !== 'draft' && own.status !== 'open'))
		error(404, { message: 'There is no such commission to edit.', code: 'not_found' });
	const isOpen = own.status === 'open';
	// Going back keeps nothing typed on this step only when it does not parse; it never blocks the way back.
	const parsed = parseForm(schema, form.data);
	if (!parsed.ok) {
		if (then === 'back' && !isOpen) redirect(303, destination(params.id, step, 'back', false));
		return fail(400, { values, errors: parsed.errors });
	}
	try {
		const input = {
			id: params.id,
			actor: { id: user.id, role: user.role, ip: event.getClientAddress() },
			changes: await toChanges(parsed.data, locals.db)
		};
		if (isOpen) await commissions.editOpen(locals.db, input);
		else await commissions.updateDraft(locals.db, input);
	} catch (cause) {
		if (!(cause instanceof commissions.CommissionError)) throw cause;
		return fail(commissions.errorStatus[cause.code] === 409 ? 409 : 400, {
			values,
			errors: issuesAsErrors(cause.issues, cause.message)
		});
	}
	redirect(303, destination(params.id, step, typeof then === 'string' ? then : null, isOpen));
}
