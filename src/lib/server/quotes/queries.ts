import { and, desc, eq, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db';
import { quote, type Quote, type QuoteStatus } from '../db/schema';
import { commissionForQuoting, commissionSummaries } from '../commissions/for-quoting';
import type { QuoteWarning } from './warnings';

export type QuoteViewer = { id: string; role: 'customer' | 'tailor' | 'admin' };

/** A quote as the API and pages answer with it: the stored row, named as the contract names it. */
export function quoteJson(row: Quote, warnings: QuoteWarning[] = []) {
	return {
		id: row.id,
		commissionId: row.commissionId,
		tailorId: row.tailorId,
		priceMinor: row.priceMinor,
		currency: row.currency,
		deliveryDate: row.deliveryDate,
		fittings: row.fittingsIncluded,
		fabricIncluded: row.fabricIncluded,
		advanceMinor: row.advanceMinor,
		message: row.message,
		validUntil: row.validUntil.toISOString(),
		status: row.status,
		declineReason: row.declineReason,
		decidedAt: row.decidedAt?.toISOString() ?? null,
		createdAt: row.createdAt.toISOString(),
		updatedAt: row.updatedAt.toISOString(),
		warnings
	};
}
export type QuoteJson = ReturnType<typeof quoteJson>;

/** Live ones first (sent, then accepted), then the history, newest first within each. */
const historyOrder = [desc(quote.createdAt), desc(quote.id)];

/**
 * A quote for one of its parties: its tailor, the commission's owner, or an admin. Null for anyone else,
 * who may not learn it exists.
 */
export async function getForParty(db: Executor, { id, viewer }: { id: string; viewer: QuoteViewer }) {
	const [row] = await db.select().from(quote).where(eq(quote.id, id)).limit(1);
	if (!row) return null;
	if (viewer.role === 'admin' || row.tailorId === viewer.id) return row;
	if (viewer.role !== 'customer') return null;
	const owner = await commissionForQuoting(db, { id: row.commissionId });
	return owner?.customerId === viewer.id ? row : null;
}

/**
 * The quotes on a commission as `viewer` may see them: its owner and admins see every one, live and past;
 * a tailor only their own (while the commission is open, or once they have quoted on it). Null when the
 * viewer may not know the commission exists.
 */
export async function listForCommission(
	db: Executor,
	{ commissionId, viewer }: { commissionId: string; viewer: QuoteViewer }
): Promise<Quote[] | null> {
	const row = await commissionForQuoting(db, { id: commissionId });
	if (!row) return null;
	const isOwner = row.customerId === viewer.id;
	if (row.status === 'draft' && !isOwner) return null;
	if (isOwner || viewer.role === 'admin')
		return db
			.select()
			.from(quote)
			.where(eq(quote.commissionId, commissionId))
			.orderBy(...historyOrder);
	if (viewer.role !== 'tailor') return null;
	const own = await db
		.select()
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.tailorId, viewer.id)))
		.orderBy(...historyOrder);
	return row.status === 'open' || own.length ? own : null;
}

/** The tailor's live (sent or accepted) quote on a commission, if any. */
export async function liveQuoteOf(
	db: Executor,
	{ commissionId, tailorId }: { commissionId: string; tailorId: string }
) {
	const [row] = await db
		.select()
		.from(quote)
		.where(
			and(
				eq(quote.commissionId, commissionId),
				eq(quote.tailorId, tailorId),
				or(eq(quote.status, 'sent'), eq(quote.status, 'accepted'))
			)
		)
		.limit(1);
	return row ?? null;
}

/** The tailor's latest quote on a commission, live or past (for the commission page's panel). */
export async function latestQuoteOf(
	db: Executor,
	{ commissionId, tailorId }: { commissionId: string; tailorId: string }
) {
	const live = await liveQuoteOf(db, { commissionId, tailorId });
	if (live) return live;
	const [row] = await db
		.select()
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.tailorId, tailorId)))
		.orderBy(...historyOrder)
		.limit(1);
	return row ?? null;
}

export const ownPageSize = 20;

/** A position in the tailor's list: the last row's creation time and id. */
function decodeCursor(cursor: string | undefined): { at: Date; id: string } | null {
	const match = cursor && /^(\d{13})_([0-9a-f-]{36})$/.exec(cursor);
	return match ? { at: new Date(Number(match[1])), id: match[2] } : null;
}

/**
 * The tailor's own quotes, newest first, keyset-paged, each with its commission's title and status;
 * `status` narrows to one status.
 */
export async function listOwn(
	db: Executor,
	{
		tailorId,
		status,
		cursor,
		limit = ownPageSize
	}: { tailorId: string; status?: QuoteStatus; cursor?: string; limit?: number }
) {
	const after = decodeCursor(cursor);
	// Cursors carry milliseconds; PostgreSQL keeps microseconds. Page on the same truncated value.
	const created = sql`date_trunc('milliseconds', ${quote.createdAt})`;
	const conditions: (SQL | undefined)[] = [
		eq(quote.tailorId, tailorId),
		status ? eq(quote.status, status) : undefined,
		after ? sql`(${created}, ${quote.id}) < (${after.at.toISOString()}::timestamptz, ${after.id}::uuid)` : undefined
	];
	const rows = await db
		.select()
		.from(quote)
		.where(and(...conditions))
		.orderBy(desc(created), desc(quote.id))
		.limit(limit + 1);
	const page = rows.slice(0, limit);
	const summaries = await commissionSummaries(db, [...new Set(page.map((row) => row.commissionId))]);
	const last = page.at(-1);
	return {
		items: page.map((row) => ({
			...quoteJson(row),
			commission: summaries.get(row.commissionId) ?? null
		})),
		nextCursor: rows.length > limit && last ? `${last.createdAt.getTime()}_${last.id}` : null
	};
}
