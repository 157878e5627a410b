import { sql } from 'drizzle-orm';
import type { BooksProblem, CurrencyReconciliation } from '$lib/types/escrow';
import type { Executor } from '../db';
import { forBooks, moneyRequestedBefore, type OrderForBooks } from '../orders/books';
import { isProcessorOutage, payments } from '../services/payments';

/**
 * The books as a whole: what the ledger says Tackline holds, paid out and kept, per currency; the processor's
 * balance beside it; and the orders whose own books do not add up or whose money should have moved by now.
 */

export type { BooksProblem, CurrencyReconciliation };

/** The ledger's totals in one currency, in its minor unit. */
export type EscrowTotals = Omit<CurrencyReconciliation, 'processorBalanceMinor' | 'difference'>;

export type Reconciliation = {
	currencies: CurrencyReconciliation[];
	processorAvailable: boolean;
	/** Why the processor could not be asked, for the desk (never sent to anyone but admins). */
	processorError: string | null;
};

/** Reads the platform's balance at the processor: currency (upper case) → available + pending, in minor units. */
export type BalanceReader = () => Promise<Map<string, number>>;

/** The processor's balance of the platform account, available and pending added up per currency. */
export const processorBalances: BalanceReader = async () => {
	const balance = await payments().balance.retrieve({}, { maxNetworkRetries: 0, timeout: 5000 });
	const byCurrency = new Map<string, number>();
	for (const part of [...balance.available, ...balance.pending]) {
		const currency = part.currency.toUpperCase();
		byCurrency.set(currency, (byCurrency.get(currency) ?? 0) + part.amount);
	}
	return byCurrency;
};

const sums = {
	charged: sql<string>`coalesce(-sum(amount_minor) filter (where account = 'customer_payments'), 0)`,
	held: sql<string>`coalesce(sum(amount_minor) filter (where account = 'escrow'), 0)`,
	released: sql<string>`coalesce(sum(amount_minor) filter (where account = 'tailor_payouts'), 0)`,
	refunded: sql<string>`coalesce(sum(amount_minor) filter (where account = 'customer_refunds'), 0)`,
	fees: sql<string>`coalesce(sum(amount_minor) filter (where account = 'platform_fees'), 0)`
};

type SumRow = { currency: string; charged: string; held: string; released: string; refunded: string; fees: string };

function totalsOf(row: SumRow): EscrowTotals {
	return {
		currency: row.currency.trim(),
		chargedMinor: Number(row.charged),
		heldMinor: Number(row.held),
		releasedMinor: Number(row.released),
		refundedMinor: Number(row.refunded),
		feesMinor: Number(row.fees)
	};
}

/** The ledger's totals per currency, alphabetically. */
export async function totalsByCurrency(db: Executor): Promise<EscrowTotals[]> {
	const result = await db.execute<SumRow>(sql`
		select currency, ${sums.charged} as charged, ${sums.held} as held, ${sums.released} as released,
			${sums.refunded} as refunded, ${sums.fees} as fees
		from ledger_entry
		group by currency
		order by currency`);
	return result.rows.map(totalsOf);
}

/**
 * The ledger's totals beside the processor's balance. A processor that cannot be reached leaves the totals
 * standing with the balance and the difference null (`processorAvailable: false`); any other failure throws.
 */
export async function reconcile(
	db: Executor,
	{ readBalance = processorBalances }: { readBalance?: BalanceReader } = {}
): Promise<Reconciliation> {
	const [totals, balance] = await Promise.all([
		totalsByCurrency(db),
		readBalance().then(
			(map) => ({ ok: true as const, map }),
			(error: unknown) => {
				if (!isProcessorOutage(error)) throw error;
				return { ok: false as const, message: error instanceof Error ? error.message : 'unreachable' };
			}
		)
	]);
	const currencies = new Map(
		totals.map((t): [string, CurrencyReconciliation] => [
			t.currency,
			{ ...t, processorBalanceMinor: null, difference: null }
		])
	);
	if (balance.ok) {
		// A currency the processor holds but the ledger never saw is a difference too.
		for (const currency of balance.map.keys())
			if (!currencies.has(currency))
				currencies.set(currency, {
					currency,
					chargedMinor: 0,
					heldMinor: 0,
					releasedMinor: 0,
					refundedMinor: 0,
					feesMinor: 0,
					processorBalanceMinor: null,
					difference: null
				});
		for (const row of currencies.values()) {
			row.processorBalanceMinor = balance.map.get(row.currency) ?? 0;
			row.difference = row.processorBalanceMinor - (row.heldMinor + row.feesMinor);
		}
	}
	return {
		currencies: [...currencies.values()].sort((a, b) => a.currency.localeCompare(b.currency)),
		processorAvailable: balance.ok,
		processorError: balance.ok ? null : balance.message
	};
}

/** The `GET /api/v1/admin/escrow` answer (see `escrowResponse`). */
export function escrowJson(r: Reconciliation) {
	return {
		currencies: r.currencies.map((c) => ({
			currency: c.currency,
			heldMinor: c.heldMinor,
			releasedMinor: c.releasedMinor,
			refundedMinor: c.refundedMinor,
			feesMinor: c.feesMinor,
			processorBalanceMinor: c.processorBalanceMinor,
			difference: c.difference
		})),
		processorAvailable: r.processorAvailable
	};
}

export type OrderBooks = EscrowTotals & {
	orderId: string;
	order: OrderForBooks | null;
	problems: BooksProblem[];
};

type OrderSumRow = SumRow & { order_id: string };

/**
 * Orders whose own books do not balance: held + released + refunded + fees ≠ charged (money parked on another
 * account, or a transaction that spans orders), escrow below zero, or a succeeded processor object (charge,
 * transfer, refund, reversal) that no ledger entry records. In order id order, `limit` from `offset`.
 */
export async function unbalancedOrders(
	db: Executor,
	{ limit = 50, offset = 0, orderIds }: { limit?: number; offset?: number; orderIds?: string[] } = {}
): Promise<{ orders: OrderBooks[]; total: number }> {
	if (orderIds?.length === 0) return { orders: [], total: 0 };
	const idList =
		orderIds &&
		sql.join(
			orderIds.map((id) => sql`${id}::uuid`),
			sql`, `
		);
	const only = idList ? sql`and order_id in (${idList})` : sql``;
	const [sumRows, unrecorded] = await Promise.all([
		db.execute<OrderSumRow>(sql`
			select order_id, currency, ${sums.charged} as charged, ${sums.held} as held, ${sums.released} as released,
				${sums.refunded} as refunded, ${sums.fees} as fees
			from ledger_entry
			where true ${only}
			group by order_id, currency`),
		db.execute<{ order_id: string; kind: string; processor_id: string; amount_minor: string; currency: string }>(sql`
			select p.order_id, p.kind, p.processor_id, p.amount_minor, p.currency
			from payment p
			where p.status = 'succeeded' ${idList ? sql`and p.order_id in (${idList})` : sql``}
				and not exists (
					select 1 from ledger_entry l where l.payment_id = p.id or l.idempotency_key = p.idempotency_key
				)`)
	]);
	const byOrder = new Map<string, OrderBooks>();
	const entryFor = (orderId: string, totals: EscrowTotals) => {
		const key = `${orderId}:${totals.currency}`;
		let found = byOrder.get(key);
		if (!found) byOrder.set(key, (found = { ...totals, orderId, order: null, problems: [] }));
		return found;
	};
	const sumsOf = new Map<string, EscrowTotals>();
	for (const row of sumRows.rows) {
		const totals = totalsOf(row);
		sumsOf.set(`${row.order_id}:${totals.currency}`, totals);
		const other =
			totals.chargedMinor - (totals.heldMinor + totals.releasedMinor + totals.refundedMinor + totals.feesMinor);
		if (other !== 0) entryFor(row.order_id, totals).problems.push({ kind: 'does_not_add_up', otherMinor: other });
		if (totals.heldMinor < 0) entryFor(row.order_id, totals).problems.push({ kind: 'negative_escrow' });
	}
	for (const row of unrecorded.rows) {
		const currency = row.currency.trim();
		const totals = sumsOf.get(`${row.order_id}:${currency}`) ?? {
			currency,
			chargedMinor: 0,
			heldMinor: 0,
			releasedMinor: 0,
			refundedMinor: 0,
			feesMinor: 0
		};
		entryFor(row.order_id, totals).problems.push({
			kind: 'payment_without_entries',
			paymentKind: row.kind,
			processorId: row.processor_id,
			amountMinor: Number(row.amount_minor)
		});
	}
	const all = [...byOrder.values()].sort(
		(a, b) => a.orderId.localeCompare(b.orderId) || a.currency.localeCompare(b.currency)
	);
	const page = all.slice(offset, offset + limit);
	const known = new Map((await forBooks(db, [...new Set(page.map((o) => o.orderId))])).map((o) => [o.id, o]));
	for (const o of page) o.order = known.get(o.orderId) ?? null;
	return { orders: page, total: all.length };
}

/** Ledger transactions whose entries do not sum to zero in a currency (the database refuses them; this checks it). */
export async function unbalancedTransactions(db: Executor): Promise<{ transactionId: string; offByMinor: number }[]> {
	const result = await db.execute<{ transaction_id: string; off: string }>(sql`
		select transaction_id, sum(amount_minor) as off
		from ledger_entry
		group by transaction_id, currency
		having sum(amount_minor) <> 0`);
	return result.rows.map((r) => ({ transactionId: r.transaction_id, offByMinor: Number(r.off) }));
}

/** An order whose release or refund was asked for long ago and whose escrow still holds money. */
export type StuckMoney = OrderForBooks & { heldMinor: number; waiting: 'release' | 'refund' };

/** How long a release or refund may take before the desk is shown it (retries with back-off included). */
export const stuckAfterMs = 60 * 60 * 1000;

/**
 * Money that should have moved and has not: the release or refund was asked for more than `olderThanMs` ago and
 * the order's escrow still holds money. Oldest request first.
 */
export async function stuckMoney(
	db: Executor,
	{ now = new Date(), olderThanMs = stuckAfterMs }: { now?: Date; olderThanMs?: number } = {}
): Promise<StuckMoney[]> {
	const holding = await db.execute<{ order_id: string; held: string }>(sql`
		select order_id, sum(amount_minor) as held
		from ledger_entry
		where account = 'escrow'
		group by order_id
		having sum(amount_minor) > 0`);
	const held = new Map(holding.rows.map((r) => [r.order_id, Number(r.held)]));
	const waiting = await moneyRequestedBefore(db, {
		ids: [...held.keys()],
		before: new Date(now.getTime() - olderThanMs)
	});
	return waiting.map((o) => ({
		...o,
		heldMinor: held.get(o.id) ?? 0,
		waiting:
			o.refundRequestedAt && (!o.releaseRequestedAt || o.refundRequestedAt > o.releaseRequestedAt)
				? ('refund' as const)
				: ('release' as const)
	}));
}
