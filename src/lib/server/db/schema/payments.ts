import { sql } from 'drizzle-orm';
import { bigint, char, check, index, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt } from './columns';
import { order } from './orders';

/** What a processor object is to an order: the customer's charge, transfers to the tailor, refunds, reversals. */
export const paymentKind = pgEnum('payment_kind', [
	'charge',
	'advance_transfer',
	'release_transfer',
	'refund',
	'reversal'
]);

/** `pending` while the processor has not confirmed it; `failed` keeps the processor's reason beside it. */
export const paymentStatus = pgEnum('payment_status', ['pending', 'succeeded', 'failed']);

/**
 * One row per object at the payment processor (a charge, a transfer, a refund, a reversal), so an order's money
 * history is rows here rather than one column per id on the order. Ledger entries reference the row they record.
 */
export const payment = pgTable(
	'payment',
	{
		id: id(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'restrict' }),
		kind: paymentKind('kind').notNull(),
		/** The processor's id (`ch_…`, `tr_…`, `re_…`, `trr_…`). */
		processorId: text('processor_id').notNull().unique(),
		amountMinor: bigint('amount_minor', { mode: 'number' }).notNull(),
		currency: char('currency', { length: 3 }).notNull(),
		status: paymentStatus('status').notNull().default('pending'),
		/** Derived from the business action (`charge:<order>`, `release:<order>`). */
		idempotencyKey: text('idempotency_key').notNull().unique(),
		failureReason: text('failure_reason'),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		index('payment_order_idx').on(t.orderId, t.createdAt),
		check('payment_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('payment_amount_positive', sql`${t.amountMinor} > 0`)
	]
);
export type Payment = typeof payment.$inferSelect;
export type NewPayment = typeof payment.$inferInsert;
export type PaymentKind = (typeof paymentKind.enumValues)[number];
export type PaymentStatus = (typeof paymentStatus.enumValues)[number];
