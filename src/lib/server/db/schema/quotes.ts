import { sql } from 'drizzle-orm';
import {
	bigint,
	boolean,
	char,
	check,
	date,
	index,
	integer,
	pgEnum,
	pgTable,
	text,
	uniqueIndex,
	uuid
} from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { commission } from './commissions';
import { tailorProfile } from './tailors';

export const quoteStatus = pgEnum('quote_status', ['sent', 'accepted', 'declined', 'withdrawn', 'lapsed']);

export const quote = pgTable(
	'quote',
	{
		id: id(),
		commissionId: uuid('commission_id')
			.notNull()
			.references(() => commission.id, { onDelete: 'cascade' }),
		tailorId: uuid('tailor_id')
			.notNull()
			.references(() => tailorProfile.userId, { onDelete: 'cascade' }),
		priceMinor: bigint('price_minor', { mode: 'number' }).notNull(),
		currency: char('currency', { length: 3 }).notNull(),
		deliveryDate: date('delivery_date', { mode: 'string' }).notNull(),
		fittingsIncluded: integer('fittings_included').notNull().default(1),
		fabricIncluded: boolean('fabric_included').notNull(),
		message: text('message').notNull().default(''),
		validUntil: instant('valid_until').notNull(),
		/** An advance for materials, released when the customer approves the fabric; only when the tailor sources it. */
		advanceMinor: bigint('advance_minor', { mode: 'number' }).notNull().default(0),
		status: quoteStatus('status').notNull().default('sent'),
		/** When it left `sent`: accepted, declined, withdrawn or lapsed. */
		decidedAt: instant('decided_at'),
		/** The customer's optional reason, or why Tackline declined it (another quote was accepted). */
		declineReason: text('decline_reason').notNull().default(''),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		// One live quote per tailor and commission; withdrawn, declined and lapsed ones stay as
		// history, so a tailor may quote again after withdrawing.
		uniqueIndex('quote_live_uq')
			.on(t.commissionId, t.tailorId)
			.where(sql`${t.status} in ('sent', 'accepted')`),
		index('quote_commission_status_idx').on(t.commissionId, t.status),
		index('quote_tailor_status_idx').on(t.tailorId, t.status, t.createdAt),
		index('quote_sent_valid_until_idx')
			.on(t.validUntil)
			.where(sql`${t.status} = 'sent'`),
		check('quote_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('quote_price_positive', sql`${t.priceMinor} > 0`),
		check('quote_fittings_nonnegative', sql`${t.fittingsIncluded} >= 0`),
		check(
			'quote_advance_within_limit',
			sql`${t.advanceMinor} >= 0 and ${t.advanceMinor}::bigint * 10 <= ${t.priceMinor}::bigint * 3 and (${t.advanceMinor} = 0 or ${t.fabricIncluded})`
		)
	]
);
export type Quote = typeof quote.$inferSelect;
export type NewQuote = typeof quote.$inferInsert;
export type QuoteStatus = (typeof quoteStatus.enumValues)[number];
