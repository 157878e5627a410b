import { and, eq, gt, inArray, ne } from 'drizzle-orm';
import * as accounts from '../accounts';
import * as audit from '../audit';
import type { Executor } from '../db';
import { fitting, type Fitting } from '../db/schema';
import { fittingChangeCutoffHours } from '../services/fitting-settings';
import {
	contextOf,
	fittingStatuses,
	lockFitting,
	lockOrderFittings,
	orderFor,
	partyForFitting,
	type Actor
} from './context';
import { FittingError, type FittingIssue } from './errors';
import { tellBooked, tellCancelled, tellOffered } from './notices';
import { maxOpenSlotsPerOrder, type CancelRequest, type OfferRequest } from './schemas';
import { describeRange, instantIn } from './time';

const hour = 60 * 60 * 1000;
const day = 24 * hour;

/** When the customer's online changes stop for a fitting: the cut-off before its start. */
export function changeableUntil(startsAt: Date, cutoffHours = fittingChangeCutoffHours()) {
	return new Date(startsAt.getTime() - cutoffHours * hour);
}

function requireOrderOpen(status: string, doing: string) {
	if (!fittingStatuses.has(status as never))
		throw new FittingError(
			'wrong_status',
			status === 'awaiting_payment'
				? `Fittings are ${doing} once the order is paid.`
				: `This order is ${status.replaceAll('_', ' ')}, so fittings can no longer be ${doing}.`
		);
}

function tooLate(cutoffHours: number, doing: string) {
	return new FittingError(
		'too_late',
		`This fitting starts in less than ${cutoffHours} hours, so it can no longer be ${doing} online. Message the other person on the order instead.`,
		[{ path: 'startsAt', message: `Changes online close ${cutoffHours} hours before the start.` }]
	);
}

async function record(tx: Executor, actor: Actor, action: string, row: Fitting, data: Record<string, unknown> = {}) {
	await audit.record(tx, {
		actorId: actor.id,
		ip: actor.ip,
		action: `fitting.${action}`,
		subjectType: 'fitting',
		subjectId: row.id,
		data: { orderId: row.orderId, startsAt: row.startsAt.toISOString(), ...data }
	});
}

/**
 * The order's tailor offers one to six times, in their own zone unless the request names one: each in the future,
 * 15–180 minutes, at the workroom or a named public place, none overlapping another open or booked time of the
 * order. The customer is told once, with every new time in their zone.
 */
export async function offer(
	db: Executor,
	{ orderId, actor, request, now = new Date() }: { orderId: string; actor: Actor; request: OfferRequest; now?: Date }
): Promise<Fitting[]> {
	const { order, side } = await orderFor(db, orderId, actor);
	if (side !== 'tailor') throw new FittingError('forbidden', 'Only the order’s tailor offers fitting times.');
	const zone = request.timeZone ?? (await accounts.getProfile(db, { id: actor.id }))?.timeZone ?? 'UTC';
	const issues: FittingIssue[] = [];
	const slots = request.slots.flatMap((slot, i) => {
		const start = instantIn(slot.start, zone);
		if (!start.ok) {
			issues.push({ path: `slots.${i}.start`, message: start.message });
			return [];
		}
		if (start.at <= now) {
			issues.push({ path: `slots.${i}.start`, message: 'That time has already passed; choose a time to come.' });
			return [];
		}
		const endsAt = new Date(start.at.getTime() + slot.durationMinutes * 60_000);
		return [{ ...slot, index: i, startsAt: start.at, endsAt }];
	});
	for (const a of slots)
		for (const b of slots)
			if (a.index < b.index && a.startsAt < b.endsAt && b.startsAt < a.endsAt)
				issues.push({
					path: `slots.${b.index}.start`,
					message: `This time overlaps time ${a.index + 1} of this offer.`
				});
	if (issues.length) throw new FittingError('invalid', 'Some times need another look.', issues);

	return db.transaction(async (tx) => {
		await lockOrderFittings(tx, orderId);
		requireOrderOpen(order.status, 'offered');
		const live = await tx
			.select({
				startsAt: fitting.startsAt,
				endsAt: fitting.endsAt,
				status: fitting.status,
				timeZone: fitting.timeZone
			})
			.from(fitting)
			.where(and(eq(fitting.orderId, orderId), inArray(fitting.status, ['proposed', 'confirmed'])));
		const clashes: FittingIssue[] = [];
		for (const slot of slots) {
			const clash = live.find((row) => slot.startsAt < row.endsAt && row.startsAt < slot.endsAt);
			if (clash)
				clashes.push({
					path: `slots.${slot.index}.start`,
					message: `This overlaps the ${clash.status === 'confirmed' ? 'booked fitting' : 'time already offered'} on ${describeRange(clash.startsAt, clash.endsAt, zone)}.`
				});
		}
		if (clashes.length)
			throw new FittingError('conflict', 'Some times overlap fittings already on this order.', clashes);
		const open = live.filter((row) => row.status === 'proposed' && row.startsAt > now).length;
		if (open + slots.length > maxOpenSlotsPerOrder)
			throw new FittingError(
				'conflict',
				`An order has at most ${maxOpenSlotsPerOrder} open times at once; withdraw some before offering more.`
			);
		const rows = await tx
			.insert(fitting)
			.values(
				slots.map((slot) => ({
					orderId,
					proposedById: actor.id,
					startsAt: slot.startsAt,
					endsAt: slot.endsAt,
					placeKind: slot.placeKind,
					address: slot.address,
					notes: slot.notes,
					timeZone: zone,
					status: 'proposed' as const
				}))
			)
			.returning();
		for (const row of rows) await record(tx, actor, 'offered', row, { timeZone: zone });
		await tellOffered(tx, await contextOf(tx, order), rows);
		return rows;
	});
}

/**
 * The customer books an open time, up to the cut-off before it starts. With a booking already ahead of them this is
 * a move: the old time is released (open again for anyone on the order to book) — also only up to its own cut-off.
 * Both people get the calendar file. Booking the same time again changes nothing.
 */
export async function book(
	db: Executor,
	{ fittingId, actor, now = new Date() }: { fittingId: string; actor: Actor; now?: Date }
): Promise<Fitting> {
	const { orderId, order, side } = await partyForFitting(db, fittingId, actor);
	if (side !== 'customer') throw new FittingError('forbidden', 'Only the customer books a fitting.');
	const cutoffHours = fittingChangeCutoffHours();
	return db.transaction(async (tx) => {
		await lockOrderFittings(tx, orderId);
		const row = await lockFitting(tx, fittingId, orderId);
		if (row.status === 'confirmed') return row;
		if (row.status !== 'proposed')
			throw new FittingError('wrong_status', `This time is ${row.status === 'done' ? 'over' : 'no longer offered'}.`);
		requireOrderOpen(order.status, 'booked');
		if (changeableUntil(row.startsAt, cutoffHours) <= now) throw tooLate(cutoffHours, 'booked');
		const [current] = await tx
			.select()
			.from(fitting)
			.where(
				and(
					eq(fitting.orderId, orderId),
					eq(fitting.status, 'confirmed'),
					gt(fitting.startsAt, now),
					ne(fitting.id, fittingId)
				)
			)
			.for('update');
		let released: Fitting | null = null;
		if (current) {
			if (changeableUntil(current.startsAt, cutoffHours) <= now) throw tooLate(cutoffHours, 'moved');
			[released] = await tx
				.update(fitting)
				.set({ status: 'proposed', bookedAt: null, remindedAt: null })
				.where(eq(fitting.id, current.id))
				.returning();
			await record(tx, actor, 'released', released, { movedTo: fittingId });
		}
		// Booked within a day of the start, the booking mail is the reminder.
		const remindedAt = row.startsAt.getTime() - now.getTime() <= day ? now : null;
		const [booked] = await tx
			.update(fitting)
			.set({ status: 'confirmed', bookedAt: now, remindedAt })
			.where(eq(fitting.id, fittingId))
			.returning();
		await record(tx, actor, 'booked', booked, released ? { movedFrom: released.id } : {});
		await tellBooked(tx, await contextOf(tx, order), { booked, released, cutoffHours });
		return booked;
	});
}

/**
 * Cancelling, by either side. The customer cancels their booking up to the cut-off. The tailor withdraws a time
 * nobody booked, or cancels a booking at any time with a reason; the customer is told. Again is a no-op.
 */
export async function cancel(
	db: Executor,
	{
		fittingId,
		actor,
		request = {},
		now = new Date()
	}: { fittingId: string; actor: Actor; request?: CancelRequest; now?: Date }
): Promise<Fitting> {
	const { orderId, order, side } = await partyForFitting(db, fittingId, actor);
	const reason = request.reason?.trim() ?? '';
	const cutoffHours = fittingChangeCutoffHours();
	return db.transaction(async (tx) => {
		await lockOrderFittings(tx, orderId);
		const row = await lockFitting(tx, fittingId, orderId);
		if (row.status === 'cancelled') return row;
		if (row.status === 'done') throw new FittingError('wrong_status', 'This fitting has taken place.');
		if (side === 'customer') {
			if (row.status !== 'confirmed')
				throw new FittingError('wrong_status', 'Only a time you booked can be cancelled; leave other times open.');
			if (changeableUntil(row.startsAt, cutoffHours) <= now) throw tooLate(cutoffHours, 'cancelled');
		} else if (row.status === 'confirmed' && !reason) {
			throw new FittingError('invalid', 'Tell the customer why the fitting is cancelled.', [
				{ path: 'reason', message: 'Give a reason: the customer is told.' }
			]);
		}
		const wasBooked = row.status === 'confirmed';
		const [cancelled] = await tx
			.update(fitting)
			.set({ status: 'cancelled', cancelledById: actor.id, cancelReason: reason })
			.where(eq(fitting.id, fittingId))
			.returning();
		await record(tx, actor, wasBooked ? 'cancelled' : 'withdrawn', cancelled, reason ? { reason } : {});
		if (wasBooked) await tellCancelled(tx, await contextOf(tx, order), cancelled, side);
		return cancelled;
	});
}

/** The tailor marks a booked fitting done once it has started. Again is a no-op. */
export async function markDone(
	db: Executor,
	{ fittingId, actor, now = new Date() }: { fittingId: string; actor: Actor; now?: Date }
): Promise<Fitting> {
	const { orderId, side } = await partyForFitting(db, fittingId, actor);
	if (side !== 'tailor') throw new FittingError('forbidden', 'Only the tailor marks a fitting done.');
	return db.transaction(async (tx) => {
		await lockOrderFittings(tx, orderId);
		const row = await lockFitting(tx, fittingId, orderId);
		if (row.status === 'done') return row;
		if (row.status !== 'confirmed') throw new FittingError('wrong_status', 'Only a booked fitting can be marked done.');
		if (row.startsAt > now) throw new FittingError('wrong_status', 'Mark the fitting done once it has started.');
		const [done] = await tx.update(fitting).set({ status: 'done' }).where(eq(fitting.id, fittingId)).returning();
		await record(tx, actor, 'done', done);
		return done;
	});
}

/** Open times that passed without a booking; listed apart from those still to choose from. */
export function isStale(row: Pick<Fitting, 'status' | 'startsAt'>, now: Date) {
	return row.status === 'proposed' && row.startsAt <= now;
}
