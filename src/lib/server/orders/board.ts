import { and, asc, desc, eq, inArray, lt, or, sql } from 'drizzle-orm';
import { z } from 'zod';
import type { OrderStatus } from '$lib/types/order';
import type { BoardCard, BoardColumn, OrderCard, WorkroomLabel } from '$lib/types/order-page';
import { namesOf } from '../accounts/names';
import { firstNameAndInitial } from '../commissions';
import { commissionSummaries } from '../commissions/for-quoting';
import type { Executor } from '../db';
import { order } from '../db/schema';
import { labelsOf } from '../workrooms/names';

const cardColumns = {
	id: order.id,
	commissionId: order.commissionId,
	customerId: order.customerId,
	tailorId: order.tailorId,
	status: order.status,
	priceMinor: order.priceMinor,
	tailorPayoutMinor: order.tailorPayoutMinor,
	currency: order.currency,
	dueDate: order.dueDate,
	createdAt: order.createdAt,
	releaseRequestedAt: order.releaseRequestedAt,
	alterationRequestedAt: order.alterationRequestedAt
};
type CardRow = {
	id: string;
	commissionId: string;
	customerId: string;
	tailorId: string;
	status: OrderStatus;
	priceMinor: number;
	tailorPayoutMinor: number;
	currency: string;
	dueDate: string;
	createdAt: Date;
	releaseRequestedAt: Date | null;
	alterationRequestedAt: Date | null;
};

/** Which board column an order's status puts it in. */
export const columnOfStatus: Record<OrderStatus, BoardColumn> = {
	awaiting_payment: 'to_start',
	funded: 'to_start',
	in_work: 'in_work',
	ready: 'ready',
	delivered: 'delivered',
	disputed: 'delivered',
	released: 'finished',
	cancelled: 'finished',
	refunded: 'finished',
	settled: 'finished'
};

const finishedStatuses = (Object.keys(columnOfStatus) as OrderStatus[]).filter(
	(status) => columnOfStatus[status] === 'finished'
);
const openStatuses = (Object.keys(columnOfStatus) as OrderStatus[]).filter(
	(status) => columnOfStatus[status] !== 'finished'
);

/** Cards for rows: the commission's title and the other party's name, read through their areas. */
async function toCards(db: Executor, rows: CardRow[], counterpart: 'customer' | 'tailor'): Promise<OrderCard[]> {
	const [summaries, names, workrooms] = await Promise.all([
		commissionSummaries(db, [...new Set(rows.map((row) => row.commissionId))]),
		counterpart === 'customer'
			? namesOf(
					db,
					rows.map((row) => row.customerId)
				)
			: new Map<string, string | null>(),
		counterpart === 'tailor'
			? labelsOf(
					db,
					rows.map((row) => row.tailorId)
				)
			: new Map<string, WorkroomLabel>()
	]);
	return rows.map((row) => {
		const summary = summaries.get(row.commissionId);
		return {
			id: row.id,
			commissionId: row.commissionId,
			title: summary?.title || 'A commission',
			garmentType: summary?.garmentType ?? null,
			status: row.status,
			priceMinor: row.priceMinor,
			tailorPayoutMinor: row.tailorPayoutMinor,
			currency: row.currency,
			dueDate: row.dueDate,
			createdAt: row.createdAt.toISOString(),
			counterpart:
				counterpart === 'customer'
					? firstNameAndInitial(names.get(row.customerId))
					: (workrooms.get(row.tailorId)?.name ?? 'The workroom'),
			releaseRequested: row.releaseRequestedAt !== null,
			alterationRequested: row.alterationRequestedAt !== null
		};
	});
}

function shiftDate(isoDate: string, days: number) {
	const at = new Date(`${isoDate}T00:00:00Z`);
	at.setUTCDate(at.getUTCDate() + days);
	return at.toISOString().slice(0, 10);
}

/** Overdue: due before today and not yet handed over. Due this week: within the next seven days. */
export function dueFlags(card: Pick<OrderCard, 'dueDate' | 'status'>, today: string) {
	const handedOver = !['awaiting_payment', 'funded', 'in_work', 'ready'].includes(card.status);
	return {
		overdue: !handedOver && card.dueDate < today,
		dueThisWeek: !handedOver && card.dueDate >= today && card.dueDate <= shiftDate(today, 6)
	};
}

/** A cursor of the finished column: the last card's due date and id, base64url JSON. */
const cursorSchema = z.object({ d: z.iso.date(), i: z.uuid() });

export function encodeCursor(card: { dueDate: string; id: string }) {
	return Buffer.from(JSON.stringify({ d: card.dueDate, i: card.id })).toString('base64url');
}

export function decodeCursor(cursor: string | undefined) {
	if (!cursor) return null;
	try {
		const parsed = cursorSchema.safeParse(JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')));
		return parsed.success ? parsed.data : null;
	} catch {
		return null;
	}
}

export const finishedPageSize = 10;
/** More open orders than any workroom takes on at once; the board shows them all. */
const openLimit = 300;

export type Board = {
	columns: Record<BoardColumn, BoardCard[]>;
	/** The cursor of the next page of finished orders, or null when there is none. */
	finishedNext: string | null;
	counts: { overdue: number; dueThisWeek: number; active: number };
};

/**
 * The tailor's orders by stage — to start, in work, ready, delivered (awaiting release), finished — each soonest
 * due first (the finished column latest due first, a page at a time), with overdue and due-this-week flagged.
 */
export async function boardFor(
	db: Executor,
	{ tailorId, today, finishedCursor }: { tailorId: string; today: string; finishedCursor?: string }
): Promise<Board> {
	const after = decodeCursor(finishedCursor);
	const [open, finished] = await Promise.all([
		db
			.select(cardColumns)
			.from(order)
			.where(and(eq(order.tailorId, tailorId), inArray(order.status, openStatuses)))
			.orderBy(asc(order.dueDate), asc(order.id))
			.limit(openLimit),
		db
			.select(cardColumns)
			.from(order)
			.where(
				and(
					eq(order.tailorId, tailorId),
					inArray(order.status, finishedStatuses),
					after ? or(lt(order.dueDate, after.d), and(eq(order.dueDate, after.d), lt(order.id, after.i))) : sql`true`
				)
			)
			.orderBy(desc(order.dueDate), desc(order.id))
			.limit(finishedPageSize + 1)
	]);
	const finishedPage = finished.slice(0, finishedPageSize);
	const cards = await toCards(db, [...open, ...finishedPage], 'customer');
	const columns: Record<BoardColumn, BoardCard[]> = {
		to_start: [],
		in_work: [],
		ready: [],
		delivered: [],
		finished: []
	};
	for (const card of cards) columns[columnOfStatus[card.status]].push({ ...card, ...dueFlags(card, today) });
	const active = cards.filter((card) => columnOfStatus[card.status] !== 'finished');
	const last = finishedPage.at(-1);
	return {
		columns,
		finishedNext: finished.length > finishedPageSize && last ? encodeCursor(last) : null,
		counts: {
			overdue: active.filter((card) => dueFlags(card, today).overdue).length,
			dueThisWeek: active.filter((card) => dueFlags(card, today).dueThisWeek).length,
			active: active.filter((card) => card.status !== 'awaiting_payment' && columnOfStatus[card.status] !== 'delivered')
				.length
		}
	};
}

export const customerPageSize = 20;

const customerCursor = z.object({ c: z.iso.datetime(), i: z.uuid() });

/** The customer's orders, newest first, a page at a time (keyset on creation time and id). */
export async function listForCustomer(
	db: Executor,
	{ customerId, cursor }: { customerId: string; cursor?: string }
): Promise<{ items: OrderCard[]; nextCursor: string | null }> {
	let after: { c: string; i: string } | null = null;
	if (cursor) {
		try {
			const parsed = customerCursor.safeParse(JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')));
			after = parsed.success ? parsed.data : null;
		} catch {
			after = null;
		}
	}
	const rows = await db
		.select(cardColumns)
		.from(order)
		.where(
			and(
				eq(order.customerId, customerId),
				// Compared at the millisecond the cursor carries, so no row is skipped or shown twice.
				after
					? sql`(date_trunc('milliseconds', ${order.createdAt}), ${order.id}) < (${after.c}::timestamptz, ${after.i}::uuid)`
					: sql`true`
			)
		)
		.orderBy(desc(sql`date_trunc('milliseconds', ${order.createdAt})`), desc(order.id))
		.limit(customerPageSize + 1);
	const page = rows.slice(0, customerPageSize);
	const last = page.at(-1);
	return {
		items: await toCards(db, page, 'tailor'),
		nextCursor:
			rows.length > customerPageSize && last
				? Buffer.from(JSON.stringify({ c: last.createdAt.toISOString(), i: last.id })).toString('base64url')
				: null
	};
}
