/** The order's lifecycle, as the database and the API name it. */
export type OrderStatus =
	| 'awaiting_payment'
	| 'funded'
	| 'in_work'
	| 'ready'
	| 'delivered'
	| 'released'
	| 'cancelled'
	| 'refunded'
	| 'disputed'
	| 'settled';

/** An order as its customer or its tailor sees it. */
export type OrderSummary = {
	id: string;
	commissionId: string;
	quoteId: string;
	customerId: string;
	tailorId: string;
	status: OrderStatus;
	priceMinor: number;
	platformFeeMinor: number;
	tailorPayoutMinor: number;
	/** The materials advance agreed in the quote, paid out of the payout when the fabric is approved (0 for none). */
	advanceMinor: number;
	platformFeeBasisPoints: number;
	currency: string;
	dueDate: string;
	createdAt: Date;
};
