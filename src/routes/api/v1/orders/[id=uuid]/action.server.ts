import { json, type RequestEvent } from '@sveltejs/kit';
import type { z } from 'zod';
import { requireUser } from '$lib/server/auth/guard';
import { apiError, parseJsonBody } from '$lib/server/http/respond';
import * as orders from '$lib/server/orders';
import * as payments from '$lib/server/payments';
import { refusedPayment } from './refused.server';

function hasBody(request: Request) {
	const length = request.headers.get('content-length');
	return request.headers.has('content-type') || (length !== null && length !== '0');
}

/** A refused order transition as the API's error body; anything else is passed to `refusedPayment`. */
export function refusedOrder(error: unknown) {
	if (error instanceof orders.OrderError)
		return apiError(orders.orderErrorStatus[error.code], error.code, error.message, error.issues);
	return refusedPayment(error);
}

/**
 * One order action over the API: the signed-in person, the body validated by `schema` (an empty body counts
 * as `{}` when `optionalBody`), the transition run, and the order view answered with the status it picks.
 */
export async function orderAction<S extends z.ZodType>(
	{ params, request, locals, getClientAddress }: RequestEvent<{ id: string }>,
	schema: S,
	run: (input: {
		orderId: string;
		actor: orders.OrderActor;
		body: z.output<S>;
	}) => Promise<{ status: number; answer?: unknown }>,
	{ optionalBody = false } = {}
): Promise<Response> {
	const user = requireUser();
	let body: z.output<S>;
	if (optionalBody && !hasBody(request)) {
		const parsed = schema.safeParse({});
		if (!parsed.success) throw new Error('An optional body must accept {}');
		body = parsed.data;
	} else {
		const parsed = await parseJsonBody(request, schema);
		if (!parsed.ok) return parsed.response;
		body = parsed.data;
	}
	const actor = { id: user.id, role: user.role, ip: getClientAddress() };
	try {
		const { status, answer } = await run({ orderId: params.id, actor, body });
		return json(answer ?? (await payments.orderView(locals.db, { orderId: params.id, viewer: user })), { status });
	} catch (error) {
		return refusedOrder(error);
	}
}
