import { sql } from 'drizzle-orm';
import { bigint, char, check, index, pgEnum, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, instant } from './columns';
import { order } from './orders';
import { payment } from './payments';

/**
 * Positive amounts flow into an account, negative ones out of it. Customer money enters from
 * `customer_payments` (which runs negative), is held in `escrow`, and leaves to
 * `customer_refunds`, or to `tailor_payable` and `platform_fees` on release; `tailor_payouts`
 * records what was transferred to tailors' connected accounts.
 */
export const ledgerAccount = pgEnum('ledger_account', [
	'customer_payments',
	'escrow',
	'customer_refunds',
	'tailor_payable',
	'tailor_payouts',
	'platform_fees'
]);

// Entries are append-only: corrections are new transactions, never updates or deletes.
export const ledgerEntry = pgTable(
	'ledger_entry',
	{
		id: id(),
		/** Groups the entries of one money movement; they sum to zero. */
		transactionId: uuid('transaction_id').notNull(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'restrict' }),
		account: ledgerAccount('account').notNull(),
		amountMinor: bigint('amount_minor', { mode: 'number' }).notNull(),
		currency: char('currency', { length: 3 }).notNull(),
		/** What happened: 'charge', 'release', 'fee', 'refund', 'transfer', 'settlement'. */
		kind: text('kind').notNull(),
		/** The processor object this movement records, when there is one (a fee kept has none). */
		paymentId: uuid('payment_id').references(() => payment.id, { onDelete: 'restrict' }),
		/** Derived from the business action (`release:<order>`), shared by a transaction's entries. */
		idempotencyKey: text('idempotency_key').notNull(),
		createdAt: createdAt()
	},
	(t) => [
		// A retried action cannot post the same account twice, whatever transaction id it drew.
		uniqueIndex('ledger_entry_idempotency_account_uq').on(t.idempotencyKey, t.account),
		index('ledger_entry_order_idx').on(t.orderId),
		index('ledger_entry_transaction_idx').on(t.transactionId),
		index('ledger_entry_payment_idx').on(t.paymentId),
		index('ledger_entry_account_idx').on(t.account, t.currency),
		check('ledger_entry_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('ledger_entry_amount_nonzero', sql`${t.amountMinor} <> 0`)
	]
);
export type LedgerEntry = typeof ledgerEntry.$inferSelect;
export type NewLedgerEntry = typeof ledgerEntry.$inferInsert;
export type LedgerAccount = (typeof ledgerAccount.enumValues)[number];

/** Payment-provider webhook events already handled, so a redelivered event is processed once. */
export const processedWebhookEvent = pgTable('processed_webhook_event', {
	eventId: text('event_id').primaryKey(),
	type: text('type').notNull(),
	receivedAt: instant('received_at').notNull().defaultNow()
});
export type ProcessedWebhookEvent = typeof processedWebhookEvent.$inferSelect;
export type NewProcessedWebhookEvent = typeof processedWebhookEvent.$inferInsert;
