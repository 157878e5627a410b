/**
 * The order's lifecycle, as one module of named transitions:
 *
 *   awaiting_payment → funded → in_work → ready → delivered → released
 *
 * with the exits `cancelled` (before payment), `refunded` (cancellation by agreement before work starts) and
 * `disputed → settled` (disputes, which this module leaves alone — a disputed order is never released here).
 *
 * Each transition checks who may do it (the order's customer, its tailor, or an admin where said), runs in a
 * transaction with the order row locked, writes an audit event, tells the other side through `notify`, and is
 * idempotent: repeating a transition that is already done returns the order as it is, with no second effect.
 * Money is moved by jobs (`order-release`, `order-refund`, `order-advance`) that the payments area runs; they
 * finish their transition here with `completeRelease`, `completeRefund` and `completeAdvance`.
 *
 * Two choices worth knowing:
 * - An alteration request keeps the order `delivered` and pauses the release clock (`auto_release_at` null)
 *   until the tailor delivers again, which starts a fresh clock. The garment has been handed over; the money
 *   stays held while it goes back and forth.
 * - Posting `fabric_sourced` does not start the work: the materials advance exists so the tailor can buy the
 *   fabric before cutting, and until another step is posted the order can still be cancelled by agreement (the
 *   advance is then reversed). Any other step moves a funded order to `in_work`.
 */
import { and, desc, eq, gte, isNotNull, isNull, lte } from 'drizzle-orm';
import * as audit from '../audit';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import {
	order,
	progressStep,
	type Order,
	type OrderStatus,
	type ProgressStep,
	type ProgressStepKind
} from '../db/schema';
import { enqueue, queueNames } from '../jobs';
import * as notifications from '../notifications';
import type { NotificationEvent } from '../notifications';
import { noteCommissionChanged } from '../search-outbox';
import { autoReleaseDays } from '../services/order-settings';
import { payments as processor } from '../services/payments';
import { OrderError } from './errors';

export type OrderActor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };
type Party = 'customer' | 'tailor' | 'admin';

const DAY_MS = 86_400_000;

/** How a status reads in a sentence. */
export const statusWords: Record<OrderStatus, string> = {
	awaiting_payment: 'awaiting payment',
	funded: 'paid and waiting for work to start',
	in_work: 'in work',
	ready: 'ready',
	delivered: 'delivered',
	released: 'released to the tailor',
	cancelled: 'cancelled',
	refunded: 'refunded',
	disputed: 'in dispute',
	settled: 'settled'
};

export const orderHref = (orderId: string) => `/orders/${orderId}`;

const notFound = () => new OrderError('not_found', 'There is no such order.');

function conflict(row: Pick<Order, 'status'>, doing: string): OrderError {
	return new OrderError('conflict', `This order is ${statusWords[row.status]}, so it cannot ${doing}.`);
}

/** Locks the order for this transaction; anyone but its parties (and an admin, when allowed) finds nothing. */
async function lock(tx: Executor, orderId: string, actor: OrderActor | null): Promise<{ row: Order; as: Party }> {
	const [row] = await tx.select().from(order).where(eq(order.id, orderId)).for('update').limit(1);
	if (!row) throw notFound();
	if (!actor) return { row, as: 'admin' };
	if (row.customerId === actor.id) return { row, as: 'customer' };
	if (row.tailorId === actor.id) return { row, as: 'tailor' };
	if (actor.role === 'admin') return { row, as: 'admin' };
	throw notFound();
}

/** Once both sides have agreed to cancel, the order takes no more work or delivery: only its refund is left. */
function refuseWhileRefunding(row: Pick<Order, 'refundRequestedAt'>, doing: string) {
	if (row.refundRequestedAt)
		throw new OrderError('conflict', `This order is being cancelled and refunded, so it cannot ${doing}.`);
}

function only(as: Party, allowed: Party[], message: string) {
	if (!allowed.includes(as)) throw new OrderError('forbidden', message);
}

async function save(tx: Executor, row: Order, set: Partial<typeof order.$inferInsert>): Promise<Order> {
	const [updated] = await tx
		.update(order)
		.set({ ...set, updatedAt: new Date() })
		.where(eq(order.id, row.id))
		.returning();
	return updated;
}

async function record(
	tx: Executor,
	row: Pick<Order, 'id'>,
	actor: OrderActor | null,
	action: string,
	data: Record<string, unknown> = {}
) {
	await audit.record(tx, {
		actorId: actor?.id ?? null,
		ip: actor?.ip ?? null,
		action,
		subjectType: 'order',
		subjectId: row.id,
		data
	});
}

/** The commission's title, for what people are told. */
async function titleOf(tx: Executor, row: Pick<Order, 'commissionId' | 'customerId'>) {
	const c = await commissions.getForOwner(tx, { id: row.commissionId, ownerId: row.customerId });
	return c?.title ?? 'your commission';
}

async function tell(
	tx: Executor,
	row: Order,
	to: 'customer' | 'tailor',
	event: NotificationEvent,
	title: string,
	body: string
) {
	await notifications.notify(tx, {
		userId: to === 'customer' ? row.customerId : row.tailorId,
		event,
		title,
		body,
		href: orderHref(row.id)
	});
}

const otherSide = (as: Party): 'customer' | 'tailor' => (as === 'customer' ? 'tailor' : 'customer');

// ---------------------------------------------------------------------------------------------------------
// Progress

export type ProgressPhoto = { key: string; thumbKey?: string | null; width: number; height: number; alt?: string };
export type ProgressInput = { step: ProgressStepKind; note?: string; photo?: ProgressPhoto | null };

/** A repeat of the same post within this window returns the first one instead of a second step. */
const repeatWindowMs = 60_000;

/**
 * The tailor posts a progress step (with an optional photo already stored by the photos area). Allowed while
 * the order is funded, in work or ready. The first step other than `fabric_sourced` starts the work: a funded
 * order moves to `in_work` and `work_started_at` is set. The customer is told.
 */
export async function postProgress(
	db: Executor,
	{ orderId, actor, input, now = new Date() }: { orderId: string; actor: OrderActor; input: ProgressInput; now?: Date }
): Promise<{ order: Order; step: ProgressStep; created: boolean }> {
	const note = (input.note ?? '').trim();
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['tailor'], 'Only the order’s tailor posts progress.');
		refuseWhileRefunding(row, 'take progress updates');
		if (!['funded', 'in_work', 'ready'].includes(row.status)) throw conflict(row, 'take progress updates');
		const [repeat] = await tx
			.select()
			.from(progressStep)
			.where(
				and(
					eq(progressStep.orderId, row.id),
					eq(progressStep.kind, input.step),
					eq(progressStep.note, note),
					gte(progressStep.recordedAt, new Date(now.getTime() - repeatWindowMs)),
					input.photo ? eq(progressStep.photoKey, input.photo.key) : isNull(progressStep.photoKey)
				)
			)
			.limit(1);
		if (repeat) return { order: row, step: repeat, created: false };
		const [step] = await tx
			.insert(progressStep)
			.values({
				orderId: row.id,
				kind: input.step,
				note,
				photoKey: input.photo?.key ?? null,
				photoThumbKey: input.photo?.thumbKey ?? null,
				photoWidth: input.photo?.width ?? null,
				photoHeight: input.photo?.height ?? null,
				photoAlt: input.photo?.alt ?? '',
				postedById: actor.id,
				recordedAt: now
			})
			.returning();
		const starts = row.status === 'funded' && input.step !== 'fabric_sourced';
		const updated = starts ? await save(tx, row, { status: 'in_work', workStartedAt: now }) : row;
		await record(tx, row, actor, 'order.progress_posted', {
			stepId: step.id,
			step: input.step,
			withPhoto: Boolean(input.photo),
			...(starts ? { from: row.status, to: 'in_work' } : {})
		});
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			'customer',
			'progress_posted',
			`News on “${title}”: ${stepWords[input.step]}`,
			`Your tailor posted an update: ${stepWords[input.step]}.${
				input.step === 'fabric_sourced' && row.advanceMinor > 0 && input.photo
					? '\n\nHave a look at the fabric. When you approve it, the materials advance is paid to your tailor.'
					: ''
			}`
		);
		return { order: updated, step, created: true };
	});
}

export const stepWords: Record<ProgressStepKind, string> = {
	fabric_sourced: 'fabric bought',
	pattern_drafted: 'pattern drafted',
	cutting: 'cut',
	first_fitting: 'first fitting',
	sewing: 'sewing',
	final_fitting: 'final fitting',
	finishing: 'finishing',
	ready: 'ready'
};

/** The order's progress steps, oldest first. */
export async function progressOf(db: Executor, orderId: string): Promise<ProgressStep[]> {
	return db
		.select()
		.from(progressStep)
		.where(eq(progressStep.orderId, orderId))
		.orderBy(progressStep.recordedAt, progressStep.id)
		.limit(200);
}

// ---------------------------------------------------------------------------------------------------------
// Ready, delivered, alterations

/** The tailor says the garment is finished: `in_work → ready`. */
export async function markReady(
	db: Executor,
	{ orderId, actor, now = new Date() }: { orderId: string; actor: OrderActor; now?: Date }
): Promise<Order> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['tailor'], 'Only the order’s tailor marks it ready.');
		refuseWhileRefunding(row, 'be marked ready');
		if (row.status === 'ready') return row;
		if (row.status !== 'in_work') throw conflict(row, 'be marked ready');
		const updated = await save(tx, row, { status: 'ready', readyAt: now });
		await record(tx, row, actor, 'order.ready', { from: row.status, to: 'ready' });
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			'customer',
			'progress_posted',
			`“${title}” is ready`,
			'Your tailor has finished the garment. They will hand it over or send it, and mark it delivered.'
		);
		return updated;
	});
}

export type DeliveryInput = { method: 'pickup' | 'courier'; trackingReference?: string | null; note?: string };

/**
 * The tailor hands the garment over: `ready | in_work → delivered`, by pickup at the workroom or by courier
 * (with its tracking reference). Starts the release clock: the money is released `AUTO_RELEASE_DAYS` later
 * unless the customer confirms first or asks for an alteration. Delivering again answers an open alteration
 * request and starts a fresh clock; delivering an order already delivered changes nothing.
 */
export async function markDelivered(
	db: Executor,
	{ orderId, actor, input, now = new Date() }: { orderId: string; actor: OrderActor; input: DeliveryInput; now?: Date }
): Promise<Order> {
	const tracking = input.trackingReference?.trim() || null;
	if (input.method === 'courier' && !tracking)
		throw new OrderError('invalid', 'A courier delivery needs its tracking reference.', [
			{ path: 'trackingReference', message: 'Enter the courier’s tracking reference.' }
		]);
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['tailor'], 'Only the order’s tailor marks it delivered.');
		refuseWhileRefunding(row, 'be marked delivered');
		const redelivery = row.status === 'delivered' && row.alterationRequestedAt !== null && !row.releaseRequestedAt;
		if (row.status === 'delivered' && !redelivery) return row;
		if (!redelivery && !['in_work', 'ready'].includes(row.status)) throw conflict(row, 'be marked delivered');
		const autoReleaseAt = new Date(now.getTime() + autoReleaseDays() * DAY_MS);
		const updated = await save(tx, row, {
			status: 'delivered',
			deliveredAt: now,
			readyAt: row.readyAt ?? now,
			deliveryMethod: input.method,
			trackingReference: input.method === 'courier' ? tracking : null,
			deliveryNote: (input.note ?? '').trim(),
			autoReleaseAt,
			alterationRequestedAt: null
		});
		await record(tx, row, actor, redelivery ? 'order.redelivered' : 'order.delivered', {
			from: row.status,
			to: 'delivered',
			method: input.method,
			trackingReference: updated.trackingReference,
			autoReleaseAt: autoReleaseAt.toISOString()
		});
		const title = await titleOf(tx, row);
		const how =
			input.method === 'courier'
				? `It is on its way by courier (tracking reference ${tracking}).`
				: 'It is waiting for you at the workroom.';
		await tell(
			tx,
			row,
			'customer',
			'delivered',
			redelivery ? `“${title}” is back from its alteration` : `“${title}” has been delivered`,
			`${how}\n\nWhen you have it and it fits, confirm delivery so your tailor is paid. If something needs changing, ask for an alteration. If you do neither, the payment is released on its own in ${autoReleaseDays()} days.`
		);
		return updated;
	});
}

/**
 * The customer asks for an alteration after delivery: the order stays `delivered` and the release clock is
 * paused until the tailor delivers again. Asking again while a request is open changes nothing.
 */
export async function requestAlteration(
	db: Executor,
	{ orderId, actor, note, now = new Date() }: { orderId: string; actor: OrderActor; note: string; now?: Date }
): Promise<Order> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['customer'], 'Only the order’s customer asks for an alteration.');
		if (row.status !== 'delivered') throw conflict(row, 'take an alteration request');
		if (row.releaseRequestedAt)
			throw new OrderError('conflict', 'You have confirmed delivery, so the payment is on its way to the tailor.');
		if (row.alterationRequestedAt) return row;
		const text = note.trim();
		const updated = await save(tx, row, {
			alterationRequestedAt: now,
			alterationNote: text,
			autoReleaseAt: null
		});
		await record(tx, row, actor, 'order.alteration_requested', { note: text });
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			'tailor',
			'alteration_requested',
			`An alteration is wanted on “${title}”`,
			`The customer asks for an alteration:\n\n${text || '(no details given — ask them in Messages)'}\n\nThe payment waits until you deliver the garment again.`
		);
		return updated;
	});
}

// ---------------------------------------------------------------------------------------------------------
// Release

async function askRelease(tx: Executor, row: Order, actor: OrderActor | null, how: 'confirmed' | 'automatic') {
	const now = new Date();
	const updated = await save(tx, row, { releaseRequestedAt: now, autoReleaseAt: null, alterationRequestedAt: null });
	await record(tx, row, actor, how === 'confirmed' ? 'order.delivery_confirmed' : 'order.auto_release', {
		releaseRequestedAt: now.toISOString()
	});
	await enqueue(tx, queueNames.orderRelease, { orderId: row.id }, { singletonKey: row.id });
	const title = await titleOf(tx, row);
	await tell(
		tx,
		row,
		'tailor',
		'released',
		how === 'confirmed' ? `“${title}”: delivery confirmed` : `“${title}”: the payment is being released`,
		how === 'confirmed'
			? 'The customer confirmed they have the garment. Your payout is on its way to your payouts account.'
			: 'The release period after delivery has passed without a request from the customer. Your payout is on its way to your payouts account.'
	);
	return updated;
}

/**
 * The customer confirms delivery: the release is asked for (`release_requested_at`) and the `order-release`
 * job transfers the payout; the order becomes `released` when the transfer has gone through and the ledger is
 * posted. Confirming again — a double click, twenty at once — returns the order and asks for nothing more.
 */
export async function confirmDelivery(
	db: Executor,
	{ orderId, actor }: { orderId: string; actor: OrderActor }
): Promise<Order> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['customer'], 'Only the order’s customer confirms delivery.');
		if (row.status === 'released' || (row.status === 'delivered' && row.releaseRequestedAt)) return row;
		if (row.status !== 'delivered')
			throw new OrderError(
				'conflict',
				`This order is ${statusWords[row.status]}; delivery can be confirmed once the tailor has marked it delivered.`
			);
		return askRelease(tx, row, actor, 'confirmed');
	});
}

/**
 * The release clock ran out: a delivered order past its `auto_release_at`, with no alteration open and no
 * release asked for yet, is released as if the customer had confirmed. Returns whether it asked for release.
 */
export async function autoRelease(db: Executor, { orderId, now = new Date() }: { orderId: string; now?: Date }) {
	return db.transaction(async (tx) => {
		const { row } = await lock(tx, orderId, null);
		const due =
			row.status === 'delivered' &&
			!row.releaseRequestedAt &&
			!row.alterationRequestedAt &&
			row.autoReleaseAt !== null &&
			row.autoReleaseAt <= now;
		if (!due) return false;
		await askRelease(tx, row, null, 'automatic');
		return true;
	});
}

/** Every order whose release clock has run out (the `order-auto-release` job). Returns how many it released. */
export async function releaseDue(db: Executor, { now = new Date(), limit = 200 } = {}): Promise<number> {
	const due = await db
		.select({ id: order.id })
		.from(order)
		.where(
			and(
				eq(order.status, 'delivered'),
				isNotNull(order.autoReleaseAt),
				lte(order.autoReleaseAt, now),
				isNull(order.releaseRequestedAt),
				isNull(order.alterationRequestedAt)
			)
		)
		.orderBy(order.autoReleaseAt)
		.limit(limit);
	let released = 0;
	for (const { id } of due) if (await autoRelease(db, { orderId: id, now })) released++;
	return released;
}

/**
 * The release transfer went through and the payments area has recorded it and posted the ledger: the order
 * is `released`. Called inside that transaction, with the order locked by it. Both sides are told.
 */
export async function completeRelease(
	tx: Executor,
	{ orderId, transferId, paidMinor }: { orderId: string; transferId: string | null; paidMinor: number }
): Promise<boolean> {
	const { row } = await lock(tx, orderId, null);
	if (row.status !== 'delivered' || !row.releaseRequestedAt) return false;
	const now = new Date();
	await save(tx, row, { status: 'released', releasedAt: now, autoReleaseAt: null });
	await record(tx, row, null, 'order.released', { transferId, paidMinor, from: 'delivered', to: 'released' });
	const title = await titleOf(tx, row);
	await tell(
		tx,
		row,
		'tailor',
		'released',
		`Payout sent for “${title}”`,
		'The payment for this order has been transferred to your payouts account.'
	);
	await tell(
		tx,
		row,
		'customer',
		'released',
		`“${title}” is complete`,
		'The payment has been released to your tailor. Thank you for commissioning through Tackline.'
	);
	return true;
}

// ---------------------------------------------------------------------------------------------------------
// Fabric advance

/**
 * The customer approves the fabric the tailor bought: allowed when the order has a materials advance and the
 * tailor has posted `fabric_sourced` with a photo. The `order-advance` job then transfers the advance, which
 * the final release deducts. Approving again changes nothing.
 */
export async function approveFabric(
	db: Executor,
	{ orderId, actor, now = new Date() }: { orderId: string; actor: OrderActor; now?: Date }
): Promise<Order> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['customer'], 'Only the order’s customer approves the fabric.');
		if (row.fabricApprovedAt) return row;
		if (row.advanceMinor <= 0)
			throw new OrderError('conflict', 'This order has no materials advance, so there is nothing to approve.');
		if (!['funded', 'in_work', 'ready'].includes(row.status) || row.refundRequestedAt)
			throw conflict(row, 'pay a materials advance');
		const [shown] = await tx
			.select({ id: progressStep.id })
			.from(progressStep)
			.where(
				and(eq(progressStep.orderId, row.id), eq(progressStep.kind, 'fabric_sourced'), isNotNull(progressStep.photoKey))
			)
			.orderBy(desc(progressStep.recordedAt))
			.limit(1);
		if (!shown)
			throw new OrderError(
				'conflict',
				'The tailor has not shown the fabric yet. They post a photo of it with the “fabric bought” step.'
			);
		const updated = await save(tx, row, { fabricApprovedAt: now });
		await record(tx, row, actor, 'order.fabric_approved', { stepId: shown.id, advanceMinor: row.advanceMinor });
		await enqueue(tx, queueNames.orderAdvance, { orderId: row.id }, { singletonKey: row.id });
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			'tailor',
			'fabric_approval',
			`Fabric approved for “${title}”`,
			'The customer approved the fabric. The materials advance is on its way to your payouts account.'
		);
		return updated;
	});
}

/** The advance transfer went through (recorded and posted by the payments area): the tailor is told. */
export async function completeAdvance(tx: Executor, { orderId }: { orderId: string }) {
	const { row } = await lock(tx, orderId, null);
	await record(tx, row, null, 'order.advance_paid', { advanceMinor: row.advanceMinor });
	const title = await titleOf(tx, row);
	await tell(
		tx,
		row,
		'tailor',
		'advance_released',
		`Materials advance sent for “${title}”`,
		'The materials advance has been transferred to your payouts account. It is deducted from the final payment.'
	);
}

// ---------------------------------------------------------------------------------------------------------
// Cancellation

/** What cancelling an unpaid order does outside this area: reopens the commission's other quotes. */
export type ReopenQuotes = (
	tx: Executor,
	input: { commissionId: string; acceptedQuoteId: string; actor: OrderActor; now: Date }
) => Promise<unknown>;

let reopenQuotes: ReopenQuotes | null = null;

/**
 * Wires the quotes area's re-opening into cancellation. The quotes area creates orders (so this area may not
 * import it); the app's `init` hook passes its function in, as it does the job workers.
 */
export function onUnpaidCancelled(reopen: ReopenQuotes) {
	reopenQuotes = reopen;
}

const requestActions = ['order.cancellation_requested', 'order.cancellation_declined', 'order.cancellation_agreed'];

export type CancellationRequest = { by: 'customer' | 'tailor'; at: Date; reason: string };

/** The open cancellation request on a funded order (one side asked, the other has not answered), or null. */
export async function openCancellationRequest(db: Executor, orderId: string): Promise<CancellationRequest | null> {
	const latest = await audit.latestOf(db, { subjectType: 'order', subjectId: orderId, actions: requestActions });
	if (!latest || latest.action !== 'order.cancellation_requested') return null;
	const by = latest.data.by === 'tailor' ? 'tailor' : 'customer';
	return { by, at: latest.at, reason: typeof latest.data.reason === 'string' ? latest.data.reason : '' };
}

export type CancelOutcome = {
	order: Order;
	/** What happened: cancelled at once, asked the other side, agreed (refund under way), or nothing new. */
	outcome: 'cancelled' | 'requested' | 'agreed' | 'unchanged';
};

const laterCancellation =
	'Work has started on this order, so it can no longer be cancelled here. If something has gone wrong, talk to the other side in Messages; a dispute can be opened once disputes are available.';

/**
 * Cancelling, by either party:
 * - an unpaid order is cancelled at once (an admin may do it too): the commission is open again, the quotes
 *   its acceptance declined are sent again (if still valid), and the open payment page is expired;
 * - a paid order before work starts is cancelled by agreement: the first side's call asks, the other side's
 *   call agrees (`agreeCancellation`), and the refund job returns the whole payment;
 * - later, cancellation goes through disputes: 409.
 */
export async function cancel(
	db: Executor,
	{ orderId, actor, reason = '', now = new Date() }: { orderId: string; actor: OrderActor; reason?: string; now?: Date }
): Promise<CancelOutcome> {
	const text = reason.trim();
	const result = await db.transaction(async (tx): Promise<CancelOutcome & { session: string | null }> => {
		const { row, as } = await lock(tx, orderId, actor);
		if (row.status === 'cancelled' || row.status === 'refunded' || row.refundRequestedAt)
			return { order: row, outcome: 'unchanged', session: null };
		if (row.status === 'awaiting_payment') return { ...(await cancelUnpaid(tx, row, as, actor, text, now)) };
		if (as === 'admin') throw new OrderError('forbidden', 'A paid order is cancelled by agreement of its two parties.');
		if (row.status !== 'funded' || row.workStartedAt) throw new OrderError('conflict', laterCancellation);
		const open = await openCancellationRequest(tx, row.id);
		if (open && open.by !== as) return { ...(await agree(tx, row, as, actor, now)), session: null };
		if (open) return { order: row, outcome: 'unchanged', session: null };
		await record(tx, row, actor, 'order.cancellation_requested', { by: as, reason: text });
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			otherSide(as),
			'order_cancelled',
			`The ${as} asks to cancel “${title}”`,
			`The ${as} would like to cancel this order before work starts${text ? `:\n\n${text}` : '.'}\n\nIf you agree, the customer gets the whole payment back. Open the order to agree or decline.`
		);
		return { order: row, outcome: 'requested', session: null };
	});
	if (result.session) await expireSession(result.session);
	return { order: result.order, outcome: result.outcome };
}

async function cancelUnpaid(
	tx: Executor,
	row: Order,
	as: Party,
	actor: OrderActor,
	reason: string,
	now: Date
): Promise<CancelOutcome & { session: string | null }> {
	if (!reopenQuotes) throw new Error('Cancelling an order needs the quotes area wired in (orders.onUnpaidCancelled)');
	const updated = await save(tx, row, { status: 'cancelled', cancelledAt: now, cancelReason: reason });
	await record(tx, row, actor, 'order.cancelled', { from: row.status, to: 'cancelled', by: as, reason });
	await commissions.reopenAfterCancelledOrder(tx, { id: row.commissionId, orderId: row.id, actor });
	await reopenQuotes(tx, { commissionId: row.commissionId, acceptedQuoteId: row.quoteId, actor, now });
	await noteCommissionChanged(tx, row.commissionId);
	const title = await titleOf(tx, row);
	const body = `The order was cancelled before it was paid${reason ? `:\n\n${reason}` : '.'}`;
	if (as !== 'customer')
		await tell(
			tx,
			row,
			'customer',
			'order_cancelled',
			`Order cancelled: “${title}”`,
			`${body}\n\nYour commission is open for quotes again.`
		);
	if (as !== 'tailor') await tell(tx, row, 'tailor', 'order_cancelled', `Order cancelled: “${title}”`, body);
	return { order: updated, outcome: 'cancelled', session: row.checkoutSessionId };
}

/** Closes the payment page of a cancelled order, when it is still open; a payment that slips through is refunded. */
async function expireSession(sessionId: string) {
	try {
		const stripe = processor();
		const session = await stripe.checkout.sessions.retrieve(sessionId);
		if (session.status === 'open') await stripe.checkout.sessions.expire(sessionId);
	} catch (error) {
		console.warn(
			`[orders] could not expire checkout session ${sessionId}: ${error instanceof Error ? error.message : String(error)}`
		);
	}
}

async function agree(tx: Executor, row: Order, as: Party, actor: OrderActor, now: Date): Promise<CancelOutcome> {
	const updated = await save(tx, row, { refundRequestedAt: now, cancelledAt: now });
	await record(tx, row, actor, 'order.cancellation_agreed', { by: as });
	await enqueue(tx, queueNames.orderRefund, { orderId: row.id }, { singletonKey: row.id });
	const title = await titleOf(tx, row);
	await tell(
		tx,
		row,
		otherSide(as),
		'order_cancelled',
		`Cancellation agreed: “${title}”`,
		'Both of you agreed to cancel this order. The customer’s payment is being refunded in full.'
	);
	return { order: updated, outcome: 'agreed' };
}

/** The other side agrees to an open cancellation request (the same as their calling `cancel`). */
export async function agreeCancellation(
	db: Executor,
	{ orderId, actor, now = new Date() }: { orderId: string; actor: OrderActor; now?: Date }
): Promise<CancelOutcome> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		if (row.refundRequestedAt || row.status === 'refunded') return { order: row, outcome: 'unchanged' };
		only(as, ['customer', 'tailor'], 'A paid order is cancelled by agreement of its two parties.');
		const open = await openCancellationRequest(tx, row.id);
		if (!open) throw new OrderError('conflict', 'Nobody has asked to cancel this order.');
		if (open.by === as) throw new OrderError('conflict', 'You asked to cancel; the other side has to agree.');
		if (row.status !== 'funded' || row.workStartedAt) throw new OrderError('conflict', laterCancellation);
		return agree(tx, row, as, actor, now);
	});
}

/** Either side turns down (or the asking side withdraws) an open cancellation request; the order goes on. */
export async function declineCancellation(
	db: Executor,
	{ orderId, actor }: { orderId: string; actor: OrderActor }
): Promise<Order> {
	return db.transaction(async (tx) => {
		const { row, as } = await lock(tx, orderId, actor);
		only(as, ['customer', 'tailor'], 'Only the order’s customer and tailor answer a cancellation request.');
		const open = await openCancellationRequest(tx, row.id);
		if (!open || row.refundRequestedAt) return row;
		await record(tx, row, actor, 'order.cancellation_declined', { by: as, requestedBy: open.by });
		const title = await titleOf(tx, row);
		await tell(
			tx,
			row,
			otherSide(as),
			'order_cancelled',
			open.by === as ? `Cancellation withdrawn: “${title}”` : `Cancellation declined: “${title}”`,
			open.by === as
				? `The ${as} withdrew their request to cancel. The order goes on.`
				: `The ${as} would rather go on with the order. Talk it over in Messages if you need to.`
		);
		return row;
	});
}

/**
 * The refund went through (recorded and posted by the payments area): a paid order cancelled by agreement is
 * `refunded`; an order cancelled before payment whose payment arrived late stays `cancelled`. Both are told.
 */
export async function completeRefund(
	tx: Executor,
	{ orderId, refundId, amountMinor }: { orderId: string; refundId: string; amountMinor: number }
): Promise<boolean> {
	const { row } = await lock(tx, orderId, null);
	if (row.status === 'refunded') return false;
	const late = row.status === 'cancelled';
	if (!late) await save(tx, row, { status: 'refunded' });
	await record(tx, row, null, late ? 'order.late_payment_refunded' : 'order.refunded', {
		refundId,
		amountMinor,
		...(late ? {} : { from: row.status, to: 'refunded' })
	});
	const title = await titleOf(tx, row);
	await tell(
		tx,
		row,
		'customer',
		'refunded',
		`Refund on its way for “${title}”`,
		late
			? 'A payment arrived after the order was cancelled, so we have refunded it in full. It reaches your card within a few working days.'
			: 'The order was cancelled by agreement and your payment has been refunded in full. It reaches your card within a few working days.'
	);
	if (!late)
		await tell(
			tx,
			row,
			'tailor',
			'refunded',
			`“${title}” refunded`,
			'The order was cancelled and the customer refunded.'
		);
	return true;
}
