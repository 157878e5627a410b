import { sql } from 'drizzle-orm';
import { bigint, char, check, date, index, integer, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { user } from './auth';
import { commission } from './commissions';
import { quote } from './quotes';
import { tailorProfile } from './tailors';

export const deliveryMethod = pgEnum('delivery_method', ['pickup', 'courier']);

export const orderStatus = pgEnum('order_status', [
	'awaiting_payment',
	'funded',
	'in_work',
	'ready',
	'delivered',
	'released',
	'cancelled',
	'refunded',
	'disputed',
	'settled'
]);

// Orders carry money and its history: every reference into and out of them restricts deletes.
export const order = pgTable(
	'order',
	{
		id: id(),
		commissionId: uuid('commission_id')
			.notNull()
			.unique()
			.references(() => commission.id, { onDelete: 'restrict' }),
		quoteId: uuid('quote_id')
			.notNull()
			.unique()
			.references(() => quote.id, { onDelete: 'restrict' }),
		customerId: uuid('customer_id')
			.notNull()
			.references(() => user.id, { onDelete: 'restrict' }),
		tailorId: uuid('tailor_id')
			.notNull()
			.references(() => tailorProfile.userId, { onDelete: 'restrict' }),
		priceMinor: bigint('price_minor', { mode: 'number' }).notNull(),
		platformFeeMinor: bigint('platform_fee_minor', { mode: 'number' }).notNull(),
		tailorPayoutMinor: bigint('tailor_payout_minor', { mode: 'number' }).notNull(),
		/** The platform fee rate in force at acceptance, in basis points (10 % is 1000). */
		platformFeeBasisPoints: integer('platform_fee_basis_points').notNull().default(1000),
		currency: char('currency', { length: 3 }).notNull(),
		/** The delivery date agreed in the quote. */
		dueDate: date('due_date', { mode: 'string' }).notNull(),
		checkoutSessionId: text('checkout_session_id').unique(),
		status: orderStatus('status').notNull().default('awaiting_payment'),
		fundedAt: instant('funded_at'),
		deliveredAt: instant('delivered_at'),
		releasedAt: instant('released_at'),
		autoReleaseAt: instant('auto_release_at'),
		/** The materials advance agreed in the quote (0 when none): at most 30 % of the price. */
		advanceMinor: bigint('advance_minor', { mode: 'number' }).notNull().default(0),
		/** When the customer approved the fabric the tailor showed, which releases the advance. */
		fabricApprovedAt: instant('fabric_approved_at'),
		workStartedAt: instant('work_started_at'),
		readyAt: instant('ready_at'),
		deliveryMethod: deliveryMethod('delivery_method'),
		/** The courier's tracking reference, when sent by courier. */
		trackingReference: text('tracking_reference'),
		deliveryNote: text('delivery_note').notNull().default(''),
		/** An open alteration request pauses the automatic release until the tailor delivers again. */
		alterationRequestedAt: instant('alteration_requested_at'),
		alterationNote: text('alteration_note').notNull().default(''),
		/** When release was asked for (confirmation or the automatic clock); the transfer may still be retrying. */
		releaseRequestedAt: instant('release_requested_at'),
		/** When a refund was asked for (cancellation after payment); the refund may still be retrying. */
		refundRequestedAt: instant('refund_requested_at'),
		cancelledAt: instant('cancelled_at'),
		cancelReason: text('cancel_reason').notNull().default(''),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		index('order_tailor_status_due_idx').on(t.tailorId, t.status, t.dueDate),
		index('order_customer_idx').on(t.customerId, t.createdAt),
		index('order_auto_release_idx')
			.on(t.autoReleaseAt)
			.where(sql`${t.status} = 'delivered'`),
		check('order_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('order_price_positive', sql`${t.priceMinor} > 0`),
		check('order_fee_nonnegative', sql`${t.platformFeeMinor} >= 0`),
		check('order_payout_nonnegative', sql`${t.tailorPayoutMinor} >= 0`),
		check('order_split_adds_up', sql`${t.platformFeeMinor} + ${t.tailorPayoutMinor} = ${t.priceMinor}`),
		check(
			'order_advance_within_limit',
			sql`${t.advanceMinor} >= 0 and ${t.advanceMinor}::bigint * 10 <= ${t.priceMinor}::bigint * 3 and ${t.advanceMinor} <= ${t.tailorPayoutMinor}`
		),
		check(
			'order_courier_tracked',
			sql`${t.deliveryMethod} is distinct from 'courier' or ${t.trackingReference} is not null`
		)
	]
);
export type Order = typeof order.$inferSelect;
export type DeliveryMethod = (typeof deliveryMethod.enumValues)[number];
export type NewOrder = typeof order.$inferInsert;
export type OrderStatus = (typeof orderStatus.enumValues)[number];

export const progressStepKind = pgEnum('progress_step_kind', [
	'fabric_sourced',
	'pattern_drafted',
	'cutting',
	'first_fitting',
	'sewing',
	'final_fitting',
	'finishing',
	'ready'
]);

export const progressStep = pgTable(
	'progress_step',
	{
		id: id(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'cascade' }),
		kind: progressStepKind('kind').notNull(),
		note: text('note').notNull().default(''),
		photoKey: text('photo_key'),
		photoThumbKey: text('photo_thumb_key'),
		photoWidth: integer('photo_width'),
		photoHeight: integer('photo_height'),
		photoAlt: text('photo_alt').notNull().default(''),
		postedById: uuid('posted_by_id').references(() => user.id, { onDelete: 'set null' }),
		recordedAt: instant('recorded_at').notNull().defaultNow()
	},
	(t) => [index('progress_step_order_idx').on(t.orderId, t.recordedAt)]
);
export type ProgressStep = typeof progressStep.$inferSelect;
export type NewProgressStep = typeof progressStep.$inferInsert;
export type ProgressStepKind = (typeof progressStepKind.enumValues)[number];

export const fittingPlace = pgEnum('fitting_place', ['workroom', 'public_place', 'customer_home']);
export const fittingStatus = pgEnum('fitting_status', ['proposed', 'confirmed', 'done', 'cancelled']);

export const fitting = pgTable(
	'fitting',
	{
		id: id(),
		orderId: uuid('order_id')
			.notNull()
			.references(() => order.id, { onDelete: 'cascade' }),
		proposedById: uuid('proposed_by_id').references(() => user.id, { onDelete: 'set null' }),
		startsAt: instant('starts_at').notNull(),
		endsAt: instant('ends_at').notNull(),
		placeKind: fittingPlace('place_kind').notNull().default('workroom'),
		address: text('address').notNull().default(''),
		status: fittingStatus('status').notNull().default('proposed'),
		notes: text('notes').notNull().default(''),
		/** The IANA zone the slot was offered in (the workroom's); each person sees it in their own zone. */
		timeZone: text('time_zone').notNull().default('UTC'),
		bookedAt: instant('booked_at'),
		/** When the day-before reminder went out, so it goes once. */
		remindedAt: instant('reminded_at'),
		cancelledById: uuid('cancelled_by_id').references(() => user.id, { onDelete: 'set null' }),
		cancelReason: text('cancel_reason').notNull().default(''),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		index('fitting_reminder_due_idx')
			.on(t.startsAt)
			.where(sql`${t.status} = 'confirmed' and ${t.remindedAt} is null`),
		index('fitting_order_idx').on(t.orderId, t.startsAt),
		check('fitting_ends_after_start', sql`${t.endsAt} > ${t.startsAt}`)
	]
);
export type Fitting = typeof fitting.$inferSelect;
export type NewFitting = typeof fitting.$inferInsert;
export type FittingPlace = (typeof fittingPlace.enumValues)[number];
export type FittingStatus = (typeof fittingStatus.enumValues)[number];
