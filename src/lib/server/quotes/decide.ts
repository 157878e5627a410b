import { and, eq, ne } from 'drizzle-orm';
import { formatDate } from '$lib/format';
import * as audit from '../audit';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import { quote, type Commission, type Quote } from '../db/schema';
import { notify } from '../notifications';
import * as orders from '../orders';
import * as payouts from '../payouts';
import { noteCommissionChanged } from '../search-outbox';
import { acceptedNotice, anotherAcceptedNotice, declinedNotice } from './decision-mails';
import { QuoteError } from './errors';
import type { AcceptResponse } from './response-schemas';
import { declineReasonMax } from './schemas';

/** Who decides: the signed-in person, with the request's address for the audit log. */
export type DecidingActor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

/** What the other quotes say when the customer accepts one: they were declined by the acceptance, not by hand. */
export const anotherQuoteAccepted = 'another quote was accepted';

const noSuchQuote = () => new QuoteError('not_found', 'There is no such quote.');

function requireCustomer(actor: DecidingActor) {
	if (actor.role !== 'customer')
		throw new QuoteError('forbidden', 'Only the customer who posted the commission decides on its quotes.');
}

/**
 * Locks, in this order, the commission (so decisions on one commission queue behind each other) and the quote.
 * Someone else's quote, or one on someone else's commission, does not exist for the actor.
 */
async function lockBoth(tx: Executor, quoteId: string, actor: DecidingActor, commissionId?: string) {
	const [found] = await tx.select({ commissionId: quote.commissionId }).from(quote).where(eq(quote.id, quoteId));
	if (!found || (commissionId && found.commissionId !== commissionId)) throw noSuchQuote();
	const row = await commissions.lockForDecision(tx, { id: found.commissionId, ownerId: actor.id });
	if (!row) throw noSuchQuote();
	const [locked] = await tx.select().from(quote).where(eq(quote.id, quoteId)).for('update');
	return { commission: row, quote: locked };
}

function notOpen(row: Commission, q: Quote): QuoteError {
	if (q.status === 'accepted')
		return new QuoteError('conflict', 'You have already accepted this quote; its order is waiting for your payment.');
	const why: Partial<Record<Commission['status'], string>> = {
		awarded: 'another quote has already been accepted',
		closed: 'it is closed',
		cancelled: 'it was cancelled',
		expired: 'it has expired',
		draft: 'it is not published'
	};
	return new QuoteError(
		'conflict',
		`This commission is no longer open for quotes: ${why[row.status] ?? row.status}. Nothing was accepted.`
	);
}

function unavailable(q: Quote, now: Date): QuoteError | null {
	if (q.status !== 'sent') {
		const words = { declined: 'was declined', withdrawn: 'was withdrawn by the tailor', lapsed: 'has lapsed' };
		return new QuoteError(
			'conflict',
			`This quote ${words[q.status as keyof typeof words] ?? `is ${q.status}`}, so it can no longer be accepted.`
		);
	}
	if (q.validUntil <= now)
		return new QuoteError(
			'conflict',
			`This quote was valid until ${formatDate(q.validUntil.toISOString().slice(0, 10))}; ask the tailor for a fresh one.`
		);
	return null;
}

/** A unique key broken by a racing acceptance (the order's commission or quote, a live quote). */
function isUniqueViolation(error: unknown): boolean {
	for (let e: unknown = error; e && typeof e === 'object'; e = (e as { cause?: unknown }).cause) {
		if ((e as { code?: unknown }).code === '23505') return true;
	}
	return false;
}

/**
 * The customer accepts a quote, all in one transaction: an order awaiting payment (price, platform fee and
 * payout that add up), the quote `accepted`, every other live quote `declined` ("another quote was accepted")
 * with its tailor told, the commission `awarded` and noted for search, and audit events for each. Refused
 * with a `conflict` when the commission is no longer open, the quote is not live or it has lapsed; a
 * simultaneous acceptance waits for the commission's lock and then gets that conflict. The unique keys of
 * `order` are the last line: their violation is a conflict as well.
 */
export async function accept(
	db: Executor,
	{
		quoteId,
		actor,
		commissionId,
		now = new Date()
	}: { quoteId: string; actor: DecidingActor; commissionId?: string; now?: Date }
): Promise<AcceptResponse> {
	requireCustomer(actor);
	try {
		return await db.transaction(async (tx) => {
			const { commission: row, quote: q } = await lockBoth(tx, quoteId, actor, commissionId);
			if (row.status !== 'open') throw notOpen(row, q);
			const refusal = unavailable(q, now);
			if (refusal) throw refusal;
			if (!(await payouts.ready(tx, q.tailorId)))
				throw new QuoteError(
					'conflict',
					'This workroom has not finished setting up payouts, so its quote cannot be accepted yet. Ask them in Messages, or choose another quote.'
				);

			const order = await orders.createOrder(tx, {
				commissionId: row.id,
				quoteId: q.id,
				customerId: row.customerId,
				tailorId: q.tailorId,
				priceMinor: q.priceMinor,
				currency: q.currency,
				dueDate: q.deliveryDate,
				advanceMinor: q.advanceMinor,
				actor
			});
			await tx.update(quote).set({ status: 'accepted', decidedAt: now, updatedAt: now }).where(eq(quote.id, q.id));
			const others = await tx
				.update(quote)
				.set({ status: 'declined', declineReason: anotherQuoteAccepted, decidedAt: now, updatedAt: now })
				.where(and(eq(quote.commissionId, row.id), eq(quote.status, 'sent'), ne(quote.id, q.id)))
				.returning({ id: quote.id, tailorId: quote.tailorId });
			if (!(await commissions.award(tx, { row, actor, quoteId: q.id, orderId: order.id }))) throw notOpen(row, q);
			await noteCommissionChanged(tx, row.id);

			const about = { commissionId: row.id, title: row.title };
			await audit.record(tx, {
				actorId: actor.id,
				ip: actor.ip,
				action: 'quote.accepted',
				subjectType: 'quote',
				subjectId: q.id,
				data: { commissionId: row.id, orderId: order.id }
			});
			await notify(tx, acceptedNotice(q.tailorId, { ...about, ...order }));
			for (const other of others) {
				await audit.record(tx, {
					actorId: actor.id,
					ip: actor.ip,
					action: 'quote.declined',
					subjectType: 'quote',
					subjectId: other.id,
					data: { commissionId: row.id, reason: anotherQuoteAccepted, acceptedQuoteId: q.id }
				});
				await notify(tx, anotherAcceptedNotice(other.tailorId, about));
			}
			return {
				orderId: order.id,
				status: 'awaiting_payment' as const,
				commissionId: row.id,
				quoteId: q.id,
				tailorId: q.tailorId,
				priceMinor: order.priceMinor,
				platformFeeMinor: order.platformFeeMinor,
				tailorPayoutMinor: order.tailorPayoutMinor,
				advanceMinor: order.advanceMinor,
				platformFeeBasisPoints: order.platformFeeBasisPoints,
				currency: order.currency,
				dueDate: order.dueDate,
				declinedQuoteIds: others.map((other) => other.id)
			};
		});
	} catch (error) {
		if (isUniqueViolation(error))
			throw new QuoteError(
				'conflict',
				'This commission is no longer open for quotes: another quote has already been accepted.'
			);
		throw error;
	}
}

/**
 * The customer declines a live quote, with an optional reason the tailor is told. Declining it again
 * changes nothing; a quote that is no longer live cannot be declined.
 */
export async function decline(
	db: Executor,
	{
		quoteId,
		actor,
		commissionId,
		reason = '',
		now = new Date()
	}: { quoteId: string; actor: DecidingActor; commissionId?: string; reason?: string; now?: Date }
): Promise<Quote> {
	requireCustomer(actor);
	const text = reason.trim();
	if (text.length > declineReasonMax)
		throw new QuoteError('invalid', 'The reason is too long.', [
			{ path: 'reason', message: `Keep the reason to ${declineReasonMax} characters.` }
		]);
	return db.transaction(async (tx) => {
		const { commission: row, quote: q } = await lockBoth(tx, quoteId, actor, commissionId);
		if (q.status === 'declined') return q;
		if (q.status !== 'sent')
			throw new QuoteError(
				'wrong_status',
				`This quote is ${q.status}; only a quote waiting for your answer can be declined.`
			);
		const [updated] = await tx
			.update(quote)
			.set({ status: 'declined', declineReason: text, decidedAt: now, updatedAt: now })
			.where(eq(quote.id, q.id))
			.returning();
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'quote.declined',
			subjectType: 'quote',
			subjectId: q.id,
			data: { commissionId: row.id, withReason: text.length > 0 }
		});
		await notify(tx, declinedNotice(q.tailorId, { commissionId: row.id, title: row.title, reason: text }));
		return updated;
	});
}
