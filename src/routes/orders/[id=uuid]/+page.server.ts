import { error, fail, redirect } from '@sveltejs/kit';
import { z } from 'zod';
import { requireUser } from '$lib/server/auth/guard';
import { keepValues, parseForm, readForm, type FieldErrors } from '$lib/server/forms';
import * as orders from '$lib/server/orders';
import * as orderForms from '$lib/server/orders/forms';
import { orderForViewer } from '$lib/server/orders/page';
import { storeUpload } from '$lib/server/photos';
import { photoErrorMessage, uploadBodyLimit } from '$lib/server/photos/api';
import type { SessionUser } from '$lib/types/user';
import { orderPageData } from './order.server';
import type { Actions, PageServerLoad, RequestEvent } from './$types';

/** The confirmation a link asked for (`?ask=confirm`): anything else reads as none. */
const askSchema = z.enum(['confirm', 'cancel']).optional().catch(undefined);
const doneSchema = z
	.enum([
		'progress',
		'ready',
		'delivered',
		'confirmed',
		'alteration',
		'fabric',
		'cancelled',
		'cancel-asked',
		'cancel-declined'
	])
	.optional()
	.catch(undefined);

const notFound = { message: 'There is no such order.', code: 'not_found' };

export const load: PageServerLoad = async ({ locals, params, url, depends, isDataRequest, setHeaders }) => {
	const user = requireUser();
	const data = await orderPageData(locals.db, {
		orderId: params.id,
		user,
		page: { isDataRequest, setHeaders, locals, depends }
	});
	if (!data) error(404, notFound);
	return {
		...data,
		ask: askSchema.parse(url.searchParams.get('ask') ?? undefined) ?? null,
		done: doneSchema.parse(url.searchParams.get('done') ?? undefined) ?? null
	};
};

type ActionName = 'progress' | 'ready' | 'deliver' | 'confirm' | 'alteration' | 'fabric' | 'cancel';

function actorOf(user: SessionUser, event: RequestEvent): orders.OrderActor {
	return { id: user.id, role: user.role, ip: event.getClientAddress() };
}

/** A refused transition: 404 for someone the order is not theirs; otherwise a failure the form shows. */
function refused(action: ActionName, cause: unknown, values: Record<string, string> = {}) {
	if (cause instanceof orders.OrderError) {
		if (cause.code === 'not_found') error(404, notFound);
		const errors: FieldErrors = { form: [cause.message] };
		for (const issue of cause.issues) (errors[issue.path] ??= []).push(issue.message);
		return fail(orders.orderErrorStatus[cause.code], { action, values, errors });
	}
	const photo = photoErrorMessage(cause);
	const errors: FieldErrors = { photo: [photo.message] };
	return fail(photo.status, { action, values, errors });
}

/** Reads and checks a small form; a failure keeps what was typed. */
async function readAction<S extends z.ZodType>(
	event: RequestEvent,
	action: ActionName,
	schema: S,
	fields: readonly string[]
) {
	const form = await readForm(event.request);
	if (!form.ok) return { ok: false as const, failure: fail(form.status, { action, values: {}, errors: form.errors }) };
	const values = keepValues(form.data, [...fields]);
	const parsed = parseForm(schema, form.data);
	if (!parsed.ok) return { ok: false as const, failure: fail(400, { action, values, errors: parsed.errors }) };
	return { ok: true as const, data: parsed.data, values };
}

const done = (event: RequestEvent, what: z.output<typeof doneSchema>) =>
	redirect(303, `/orders/${event.params.id}?done=${what}`);

export const actions: Actions = {
	/** The tailor posts a step, with an optional photo stored through the photo pipeline. */
	progress: async (event) => {
		const user = requireUser();
		// Someone the order is not theirs learns nothing, and no photo of theirs is processed or stored.
		if (!(await orderForViewer(event.locals.db, { orderId: event.params.id, viewer: user }))) error(404, notFound);
		const form = await readForm(event.request, { limit: uploadBodyLimit });
		if (!form.ok) return fail(form.status, { action: 'progress' as const, values: {}, errors: form.errors });
		const values = keepValues(form.data, [...orderForms.keptFields.progress]);
		const parsed = parseForm(orderForms.progressForm.extend({ photo: z.any().optional() }), form.data);
		if (!parsed.ok) return fail(400, { action: 'progress' as const, values, errors: parsed.errors });
		const { step, note, photoAlt } = parsed.data;
		const file = form.data.get('photo');
		const post = (photo: orders.ProgressPhoto | null) =>
			orders.postProgress(event.locals.db, {
				orderId: event.params.id,
				actor: actorOf(user, event),
				input: { step, note, photo }
			});
		try {
			if (file instanceof File && file.size > 0) {
				await storeUpload(file, (stored) =>
					post({
						key: stored.key,
						thumbKey: stored.thumbKey,
						width: stored.width,
						height: stored.height,
						alt: photoAlt
					})
				);
			} else await post(null);
		} catch (cause) {
			return refused('progress', cause, values);
		}
		done(event, 'progress');
	},
	ready: async (event) => {
		const user = requireUser();
		try {
			await orders.markReady(event.locals.db, { orderId: event.params.id, actor: actorOf(user, event) });
		} catch (cause) {
			return refused('ready', cause);
		}
		done(event, 'ready');
	},
	deliver: async (event) => {
		const user = requireUser();
		const read = await readAction(event, 'deliver', orderForms.deliverForm, orderForms.keptFields.deliver);
		if (!read.ok) return read.failure;
		const { method, trackingReference, note } = read.data;
		try {
			await orders.markDelivered(event.locals.db, {
				orderId: event.params.id,
				actor: actorOf(user, event),
				input: { method, trackingReference: method === 'courier' ? trackingReference : null, note }
			});
		} catch (cause) {
			return refused('deliver', cause, read.values);
		}
		done(event, 'delivered');
	},
	/** The customer confirms delivery: this releases the payment to the workroom. */
	confirm: async (event) => {
		const user = requireUser();
		try {
			await orders.confirmDelivery(event.locals.db, { orderId: event.params.id, actor: actorOf(user, event) });
		} catch (cause) {
			return refused('confirm', cause);
		}
		done(event, 'confirmed');
	},
	alteration: async (event) => {
		const user = requireUser();
		const read = await readAction(event, 'alteration', orderForms.alterationForm, orderForms.keptFields.alteration);
		if (!read.ok) return read.failure;
		try {
			await orders.requestAlteration(event.locals.db, {
				orderId: event.params.id,
				actor: actorOf(user, event),
				note: read.data.note
			});
		} catch (cause) {
			return refused('alteration', cause, read.values);
		}
		done(event, 'alteration');
	},
	approveFabric: async (event) => {
		const user = requireUser();
		try {
			await orders.approveFabric(event.locals.db, { orderId: event.params.id, actor: actorOf(user, event) });
		} catch (cause) {
			return refused('fabric', cause);
		}
		done(event, 'fabric');
	},
	/** Cancels an unpaid order at once; on a paid one asks the other side, or agrees when they asked. */
	cancel: async (event) => {
		const user = requireUser();
		const read = await readAction(event, 'cancel', orderForms.cancelForm, orderForms.keptFields.cancel);
		if (!read.ok) return read.failure;
		let outcome: orders.CancelOutcome['outcome'];
		try {
			({ outcome } = await orders.cancel(event.locals.db, {
				orderId: event.params.id,
				actor: actorOf(user, event),
				reason: read.data.reason
			}));
		} catch (cause) {
			return refused('cancel', cause, read.values);
		}
		done(event, outcome === 'requested' ? 'cancel-asked' : 'cancelled');
	},
	/** The other side asked to cancel a paid order; this one says no and the order goes on. */
	declineCancel: async (event) => {
		const user = requireUser();
		try {
			await orders.declineCancellation(event.locals.db, { orderId: event.params.id, actor: actorOf(user, event) });
		} catch (cause) {
			return refused('cancel', cause);
		}
		done(event, 'cancel-declined');
	}
};
