import { sql } from 'drizzle-orm';
import {
	char,
	check,
	date,
	doublePrecision,
	index,
	integer,
	jsonb,
	pgEnum,
	pgTable,
	text,
	uuid
} from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { user } from './auth';
import type { MeasurementTaker, MeasurementValuesMm } from './measurements';

export const fabricSource = pgEnum('fabric_source', ['customer_supplies', 'tailor_sources']);
export const handover = pgEnum('handover', ['pickup', 'delivery']);
export const commissionStatus = pgEnum('commission_status', [
	'draft',
	'open',
	'awarded',
	'closed',
	'cancelled',
	'expired'
]);

/** The measurements as they were when the commission was posted; later profile edits do not touch it. */
export type MeasurementSnapshot = {
	/** The profile it was copied from, kept for reference only (the profile may be edited or deleted). */
	profileId: string | null;
	label: string;
	valuesMm: MeasurementValuesMm;
	takenBy: MeasurementTaker;
	takenAt: string | null;
};

export const commission = pgTable(
	'commission',
	{
		id: id(),
		// An awarded commission cannot go this way: its order restricts the delete.
		customerId: uuid('customer_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		/** Garment type id from the catalogue in code. */
		garmentType: text('garment_type').notNull(),
		title: text('title').notNull(),
		styleNotes: text('style_notes').notNull().default(''),
		measurementSnapshot: jsonb('measurement_snapshot').$type<MeasurementSnapshot>(),
		/** What quoting tailors see instead of the measurements, e.g. "bust 92–96 cm, hip 98–102 cm". */
		sizeBand: text('size_band'),
		fabricSource: fabricSource('fabric_source').notNull().default('tailor_sources'),
		fabricNotes: text('fabric_notes').notNull().default(''),
		budgetMinMinor: integer('budget_min_minor'),
		budgetMaxMinor: integer('budget_max_minor'),
		currency: char('currency', { length: 3 }).notNull(),
		dateNeeded: date('date_needed', { mode: 'string' }),
		city: text('city'),
		district: text('district'),
		/** Already coarsened (about a kilometre); the exact address is never stored here. */
		approxLat: doublePrecision('approx_lat'),
		approxLng: doublePrecision('approx_lng'),
		handover: handover('handover').notNull().default('pickup'),
		status: commissionStatus('status').notNull().default('draft'),
		publishedAt: instant('published_at'),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		// Ascending on purpose: a backward scan serves `order by published_at desc, id desc` exactly,
		// whereas drizzle-kit's `.desc()` adds NULLS LAST, which that plain `desc` ordering cannot use.
		index('commission_status_published_idx').on(t.status, t.publishedAt, t.id),
		index('commission_garment_status_idx').on(t.garmentType, t.status, t.publishedAt),
		index('commission_city_status_idx').on(t.city, t.district, t.status),
		index('commission_open_location_idx')
			.on(t.approxLat, t.approxLng)
			.where(sql`${t.status} = 'open'`),
		index('commission_customer_idx').on(t.customerId, t.createdAt),
		check('commission_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('commission_budget_min_nonnegative', sql`${t.budgetMinMinor} >= 0`),
		check('commission_budget_order', sql`${t.budgetMinMinor} <= ${t.budgetMaxMinor}`),
		check(
			'commission_posted_has_snapshot',
			sql`${t.status} in ('draft', 'cancelled') or (${t.measurementSnapshot} is not null and ${t.publishedAt} is not null)`
		)
	]
);
export type Commission = typeof commission.$inferSelect;
export type NewCommission = typeof commission.$inferInsert;
export type CommissionStatus = (typeof commissionStatus.enumValues)[number];
export type FabricSource = (typeof fabricSource.enumValues)[number];
export type Handover = (typeof handover.enumValues)[number];

export const commissionPhoto = pgTable(
	'commission_photo',
	{
		id: id(),
		commissionId: uuid('commission_id')
			.notNull()
			.references(() => commission.id, { onDelete: 'cascade' }),
		storageKey: text('storage_key').notNull().unique(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		width: integer('width').notNull(),
		height: integer('height').notNull(),
		sortOrder: integer('sort_order').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [
		index('commission_photo_commission_idx').on(t.commissionId, t.sortOrder),
		check('commission_photo_size_positive', sql`${t.bytes} > 0 and ${t.width} > 0 and ${t.height} > 0`)
	]
);
export type CommissionPhoto = typeof commissionPhoto.$inferSelect;
export type NewCommissionPhoto = typeof commissionPhoto.$inferInsert;
