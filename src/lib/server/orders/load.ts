import { and, between, eq, gte, inArray, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { order, type OrderStatus } from '../db/schema';

/** Orders a workroom has taken on and not yet handed over: they take up its capacity. */
export const activeOrderStatuses: OrderStatus[] = ['awaiting_payment', 'funded', 'in_work', 'ready'];

function shiftDate(isoDate: string, days: number) {
	const at = new Date(`${isoDate}T00:00:00Z`);
	at.setUTCDate(at.getUTCDate() + days);
	return at.toISOString().slice(0, 10);
}

/**
 * How many of the tailor's active orders are due within `windowDays` either side of `date`: the work
 * that competes for the same weeks as a new garment due then.
 */
export async function activeOrdersAround(
	db: Executor,
	{ tailorId, date, windowDays = 14 }: { tailorId: string; date: string; windowDays?: number }
): Promise<{ count: number; from: string; to: string }> {
	const from = shiftDate(date, -windowDays);
	const to = shiftDate(date, windowDays);
	const [row] = await db
		.select({ count: sql<number>`count(*)`.mapWith(Number) })
		.from(order)
		.where(
			and(eq(order.tailorId, tailorId), inArray(order.status, activeOrderStatuses), between(order.dueDate, from, to))
		);
	return { count: row?.count ?? 0, from, to };
}

/** The due dates of the tailor's active orders from `from` on, soonest first: the workroom's booked weeks. */
export async function activeOrderDueDates(db: Executor, { tailorId, from }: { tailorId: string; from: string }) {
	const rows = await db
		.select({ dueDate: order.dueDate })
		.from(order)
		.where(and(eq(order.tailorId, tailorId), inArray(order.status, activeOrderStatuses), gte(order.dueDate, from)))
		.orderBy(order.dueDate)
		.limit(500);
	return rows.map((row) => row.dueDate);
}
