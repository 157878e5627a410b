/** The books as the desk shows them (built by `payments.escrow`). */

/** One currency reconciled: the processor should hold what escrow holds plus the fees kept. */
export type CurrencyReconciliation = {
	currency: string;
	/** What customers paid in. */
	chargedMinor: number;
	/** What escrow still holds for orders not yet released or refunded. */
	heldMinor: number;
	/** What reached tailors: advances and releases. */
	releasedMinor: number;
	/** What went back to customers. */
	refundedMinor: number;
	/** What Tackline kept as its fee. */
	feesMinor: number;
	/** Available plus pending at the processor; null when it could not be asked. */
	processorBalanceMinor: number | null;
	/** processorBalanceMinor − (heldMinor + feesMinor): 0 when the books agree, null when the processor could not be asked. */
	difference: number | null;
};

/** What is wrong with one order's books. */
export type BooksProblem =
	| { kind: 'does_not_add_up'; otherMinor: number }
	| { kind: 'negative_escrow' }
	| { kind: 'payment_without_entries'; paymentKind: string; processorId: string; amountMinor: number };
