import { and, asc, eq, inArray } from 'drizzle-orm';
import type { FittingsSummary } from '$lib/types/fittings';
import type { Executor } from '../db';
import { fitting, type Fitting } from '../db/schema';
import * as orders from '../orders';
import { fittingChangeCutoffHours } from '../services/fitting-settings';
import {
	contextOf,
	fittingStatuses,
	fittingsHref,
	noSuchFitting,
	orderForReader,
	partyForFitting,
	placeText,
	readerPerson,
	type Actor,
	type OrderContext,
	type Person,
	type Reader,
	type Side
} from './context';
import { FittingError } from './errors';
import { calendarFile, whenLines } from './notices';
import { changeableUntil } from './transitions';
import { minutesBetween, wallClockIn } from './time';

/** A fitting as one of the two people sees it: times in their zone first, and what they may do with it now. */
export type FittingView = {
	id: string;
	orderId: string;
	status: Fitting['status'];
	startsAt: Date;
	endsAt: Date;
	durationMinutes: number;
	timeZone: string;
	localStart: string;
	placeKind: Fitting['placeKind'];
	place: string;
	notes: string;
	bookedAt: Date | null;
	cancelledBy: Side | null;
	cancelReason: string;
	changeableUntil: Date;
	/** Human-readable times: the viewer's zone first, then the fitting's and the other person's when they differ. */
	when: string[];
	/** Proposed and still ahead; `bookable` only while before the cut-off. */
	open: boolean;
	upcoming: boolean;
	/** Still ahead but inside the cut-off: the customer can no longer book, move or cancel it online. */
	pastCutoff: boolean;
	can: {
		book: boolean;
		cancel: boolean;
		withdraw: boolean;
		cancelBooking: boolean;
		markDone: boolean;
		calendar: boolean;
	};
};

export type FittingsPage = {
	order: { id: string; status: string; commissionId: string; dueDate: string };
	/** `admin`: an administrator reading the order's fittings; they change nothing. */
	side: Reader;
	/** Whether fittings can be offered and booked on the order now (paid, not yet delivered). */
	active: boolean;
	cutoffHours: number;
	viewerZone: string;
	otherZone: string;
	fittingZone: string;
	workroomName: string;
	/** What a new offer's place field starts from: the workroom's district and town. */
	workroomPlace: string;
	fittings: FittingView[];
};

/** Whose zone comes first and whose beside it: an admin sees their own zone, the fitting's and the customer's. */
type Viewpoint = { side: Reader; me: Person; other: Person };

async function viewpointOf(db: Executor, ctx: OrderContext, side: Reader, actor: Actor): Promise<Viewpoint> {
	if (side === 'customer') return { side, me: ctx.customer, other: ctx.tailor };
	if (side === 'tailor') return { side, me: ctx.tailor, other: ctx.customer };
	return { side, me: await readerPerson(db, actor.id), other: ctx.customer };
}

function view(
	row: Fitting,
	ctx: OrderContext,
	{ side, me, other }: Viewpoint,
	now: Date,
	cutoffHours: number
): FittingView {
	const until = changeableUntil(row.startsAt, cutoffHours);
	const beforeCutoff = now < until;
	const active = fittingStatuses.has(ctx.order.status);
	const upcoming = row.startsAt > now;
	const cancelledBy =
		row.cancelledById === ctx.customer.id ? 'customer' : row.cancelledById === ctx.tailor.id ? 'tailor' : null;
	return {
		id: row.id,
		orderId: row.orderId,
		status: row.status,
		startsAt: row.startsAt,
		endsAt: row.endsAt,
		durationMinutes: minutesBetween(row.startsAt, row.endsAt),
		timeZone: row.timeZone,
		localStart: wallClockIn(row.startsAt, row.timeZone),
		placeKind: row.placeKind,
		place: placeText(row, ctx.workroom),
		notes: row.notes,
		bookedAt: row.bookedAt,
		cancelledBy: row.status === 'cancelled' ? cancelledBy : null,
		cancelReason: row.status === 'cancelled' ? row.cancelReason : '',
		changeableUntil: until,
		when: whenLines(row, me, other),
		open: row.status === 'proposed' && upcoming,
		upcoming,
		pastCutoff: upcoming && !beforeCutoff && (row.status === 'proposed' || row.status === 'confirmed'),
		can: {
			book: side === 'customer' && active && row.status === 'proposed' && beforeCutoff,
			cancel: side === 'customer' && row.status === 'confirmed' && upcoming && beforeCutoff,
			withdraw: side === 'tailor' && row.status === 'proposed',
			cancelBooking: side === 'tailor' && row.status === 'confirmed',
			markDone: side === 'tailor' && row.status === 'confirmed' && !upcoming,
			calendar:
				side !== 'admin' &&
				(row.status === 'confirmed' || row.status === 'done' || (row.status === 'cancelled' && row.bookedAt !== null))
		}
	};
}

async function rowsOf(db: Executor, orderId: string) {
	return db.select().from(fitting).where(eq(fitting.orderId, orderId)).orderBy(asc(fitting.startsAt));
}

/**
 * The order's fittings for one of its parties, or read-only for an admin; a `not_found` FittingError for
 * anyone else.
 */
export async function listForOrder(
	db: Executor,
	{ orderId, actor, now = new Date() }: { orderId: string; actor: Actor; now?: Date }
): Promise<FittingsPage> {
	const { order, side } = await orderForReader(db, orderId, actor);
	const [ctx, rows] = await Promise.all([contextOf(db, order), rowsOf(db, orderId)]);
	const cutoffHours = fittingChangeCutoffHours();
	const viewpoint = await viewpointOf(db, ctx, side, actor);
	const { me, other } = viewpoint;
	return {
		order: { id: order.id, status: order.status, commissionId: order.commissionId, dueDate: order.dueDate },
		side,
		active: fittingStatuses.has(order.status),
		cutoffHours,
		viewerZone: me.timeZone,
		otherZone: other.timeZone,
		fittingZone: ctx.tailor.timeZone,
		workroomName: ctx.workroom.name,
		workroomPlace: [ctx.workroom.district, ctx.workroom.town].filter(Boolean).join(', '),
		fittings: rows.map((row) => view(row, ctx, viewpoint, now, cutoffHours))
	};
}

/** One fitting for one of its parties. */
export async function getForParty(
	db: Executor,
	{ fittingId, actor, now = new Date() }: { fittingId: string; actor: Actor; now?: Date }
): Promise<FittingView> {
	const { order, side } = await partyForFitting(db, fittingId, actor);
	const ctx = await contextOf(db, order);
	const [row] = await db.select().from(fitting).where(eq(fitting.id, fittingId));
	return view(row, ctx, await viewpointOf(db, ctx, side, actor), now, fittingChangeCutoffHours());
}

/** The `.ics` of a fitting for one of its parties: REQUEST while booked, CANCEL once a booking was cancelled. */
export async function calendarForParty(
	db: Executor,
	{ fittingId, orderId, actor }: { fittingId: string; orderId?: string; actor: Actor }
) {
	const { order } = await partyForFitting(db, fittingId, actor);
	if (orderId && order.id !== orderId) throw noSuchFitting();
	const [row] = await db.select().from(fitting).where(eq(fitting.id, fittingId));
	// An open time has nothing to put in a calendar until it is booked.
	if (row.status === 'proposed') throw new FittingError('not_found', 'This time is not booked.');
	const ctx = await contextOf(db, order);
	return calendarFile(db, row, ctx);
}

/**
 * What the order page shows about fittings: the next booked one and how many times are open. For the two
 * parties and admins; null for anyone else.
 */
export async function summaryFor(
	db: Executor,
	{ orderId, actor, now = new Date() }: { orderId: string; actor: Actor; now?: Date }
): Promise<FittingsSummary | null> {
	const order = await orders.getForViewer(db, { viewer: actor, orderId });
	if (!order) return null;
	const side: Reader = order.customerId === actor.id ? 'customer' : order.tailorId === actor.id ? 'tailor' : 'admin';
	const rows = await db
		.select()
		.from(fitting)
		.where(and(eq(fitting.orderId, orderId), inArray(fitting.status, ['proposed', 'confirmed'])))
		.orderBy(asc(fitting.startsAt));
	const ahead = rows.filter((row) => row.startsAt > now);
	const booked = ahead.find((row) => row.status === 'confirmed');
	let next: FittingsSummary['next'] = null;
	if (booked) {
		const ctx = await contextOf(db, order);
		const { me, other } = await viewpointOf(db, ctx, side, actor);
		next = { when: whenLines(booked, me, other), place: placeText(booked, ctx.workroom) };
	}
	return {
		href: fittingsHref(orderId),
		next,
		openCount: ahead.filter((row) => row.status === 'proposed').length,
		active: fittingStatuses.has(order.status),
		side
	};
}
