import type { CurrencyReconciliation } from '$lib/types/escrow';

/**
 * The currencies worth a card on the desk: those the ledger or the processor has any money in. The processor
 * answers a balance even for an account that never took a payment (a zero in its home currency); a card of
 * zeros says nothing, so it is left out and the page's empty state shows instead.
 */
export function currenciesWithMoney(rows: CurrencyReconciliation[]): CurrencyReconciliation[] {
	return rows.filter(
		(row) =>
			row.chargedMinor !== 0 ||
			row.heldMinor !== 0 ||
			row.releasedMinor !== 0 ||
			row.refundedMinor !== 0 ||
			row.feesMinor !== 0 ||
			(row.processorBalanceMinor ?? 0) !== 0
	);
}
