import { sql } from 'drizzle-orm';
import { bigint, char, check, index, pgEnum, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { user } from './auth';
import { order } from './orders';

export const disputeReason = pgEnum('dispute_reason', [
	'poor_fit',
	'not_as_agreed',
	'workmanship',
	'fabric_problem',
	'late',
	'not_delivered',
	'other'
]);
export const disputeStatus = pgEnum('dispute_status', ['open', 'settled', 'withdrawn']);

export const dispute = pgTable(
	'dispute',
	{
		id: id(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'restrict' }),
		openedById: uuid('opened_by_id')
			.notNull()
			.references(() => user.id, { onDelete: 'restrict' }),
		reason: disputeReason('reason').notNull(),
		statement: text('statement').notNull(),
		status: disputeStatus('status').notNull().default('open'),
		/** Settlement: refund R to the customer, release P to the tailor, fee taken from P; R + P = held. */
		refundMinor: bigint('refund_minor', { mode: 'number' }),
		releaseMinor: bigint('release_minor', { mode: 'number' }),
		feeMinor: bigint('fee_minor', { mode: 'number' }),
		currency: char('currency', { length: 3 }).notNull(),
		// Who settled stays readable in the audit log; the row outlives an admin's account.
		settledById: uuid('settled_by_id').references(() => user.id, { onDelete: 'set null' }),
		settlementNote: text('settlement_note'),
		settledAt: instant('settled_at'),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		uniqueIndex('dispute_one_open_per_order_uq')
			.on(t.orderId)
			.where(sql`${t.status} = 'open'`),
		index('dispute_order_idx').on(t.orderId),
		index('dispute_status_created_idx').on(t.status, t.createdAt),
		check('dispute_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('dispute_refund_nonnegative', sql`${t.refundMinor} >= 0`),
		check('dispute_release_nonnegative', sql`${t.releaseMinor} >= 0`),
		check('dispute_fee_within_release', sql`${t.feeMinor} >= 0 and ${t.feeMinor} <= ${t.releaseMinor}`),
		check(
			'dispute_settled_complete',
			sql`${t.status} <> 'settled' or (${t.refundMinor} is not null and ${t.releaseMinor} is not null and ${t.feeMinor} is not null and ${t.settledAt} is not null)`
		)
	]
);
export type Dispute = typeof dispute.$inferSelect;
export type NewDispute = typeof dispute.$inferInsert;
export type DisputeReason = (typeof disputeReason.enumValues)[number];
export type DisputeStatus = (typeof disputeStatus.enumValues)[number];

export const disputeEvidence = pgTable(
	'dispute_evidence',
	{
		id: id(),
		disputeId: uuid('dispute_id')
			.notNull()
			.references(() => dispute.id, { onDelete: 'cascade' }),
		authorId: uuid('author_id').references(() => user.id, { onDelete: 'set null' }),
		statement: text('statement').notNull().default(''),
		storageKey: text('storage_key').unique(),
		contentType: text('content_type'),
		createdAt: createdAt()
	},
	(t) => [
		index('dispute_evidence_dispute_idx').on(t.disputeId, t.createdAt),
		check('dispute_evidence_not_empty', sql`${t.statement} <> '' or ${t.storageKey} is not null`)
	]
);
export type DisputeEvidence = typeof disputeEvidence.$inferSelect;
export type NewDisputeEvidence = typeof disputeEvidence.$inferInsert;
