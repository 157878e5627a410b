import { sql } from 'drizzle-orm';
import {
	bigint,
	char,
	check,
	date,
	doublePrecision,
	index,
	integer,
	jsonb,
	pgEnum,
	pgTable,
	primaryKey,
	text,
	uuid
} from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { lengthUnit, user } from './auth';
import { measurementProfile, measurementTaker, type MeasurementValuesMm } from './measurements';

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
		/** What the customer calls the garment when `garment_type` is `other`. */
		garmentOther: text('garment_other').notNull().default(''),
		/** The profile chosen while drafting; publishing copies it into `commission_measurements`. */
		measurementProfileId: uuid('measurement_profile_id').references(() => measurementProfile.id, {
			onDelete: 'set null'
		}),
		title: text('title').notNull(),
		styleNotes: text('style_notes').notNull().default(''),
		fabricSource: fabricSource('fabric_source').notNull().default('tailor_sources'),
		fabricNotes: text('fabric_notes').notNull().default(''),
		budgetMinMinor: bigint('budget_min_minor', { mode: 'number' }),
		budgetMaxMinor: bigint('budget_max_minor', { mode: 'number' }),
		currency: char('currency', { length: 3 }).notNull(),
		dateNeeded: date('date_needed', { mode: 'string' }),
		/** ISO 3166-1 alpha-2 of the chosen place. */
		countryCode: char('country_code', { length: 2 }),
		city: text('city'),
		district: text('district'),
		/** Already coarsened (about a kilometre); the exact address is never stored here. */
		approxLat: doublePrecision('approx_lat'),
		approxLng: doublePrecision('approx_lng'),
		handover: handover('handover').notNull().default('pickup'),
		status: commissionStatus('status').notNull().default('draft'),
		publishedAt: instant('published_at'),
		/** When an open commission with no accepted quote lapses to `expired`; set on publish. */
		expiresAt: instant('expires_at'),
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
		index('commission_open_expiry_idx')
			.on(t.expiresAt)
			.where(sql`${t.status} = 'open'`),
		check('commission_currency_iso', sql`${t.currency} ~ '^[A-Z]{3}$'`),
		check('commission_budget_min_nonnegative', sql`${t.budgetMinMinor} >= 0`),
		check('commission_budget_order', sql`${t.budgetMinMinor} <= ${t.budgetMaxMinor}`),
		// Publishing writes the measurements snapshot and the size band in the same transaction.
		check(
			'commission_posted_has_published_at',
			sql`${t.status} in ('draft', 'cancelled') or ${t.publishedAt} is not null`
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
		/** The 480 px re-encoded copy. */
		thumbKey: text('thumb_key').unique(),
		altText: text('alt_text').notNull().default(''),
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

/**
 * The measurements as they were when the commission was published; later profile edits do not touch it.
 * Kept off the listing row so that only queries made for permitted readers ever load it.
 */
export const commissionMeasurements = pgTable('commission_measurements', {
	commissionId: uuid('commission_id')
		.primaryKey()
		.references(() => commission.id, { onDelete: 'cascade' }),
	/** The profile it was copied from, for reference only (the profile may be edited or deleted). */
	profileId: uuid('profile_id'),
	label: text('label').notNull(),
	unit: lengthUnit('unit').notNull().default('cm'),
	valuesMm: jsonb('values_mm').$type<MeasurementValuesMm>().notNull(),
	takenBy: measurementTaker('taken_by').notNull().default('self'),
	takenAt: instant('taken_at'),
	createdAt: createdAt()
});
export type CommissionMeasurements = typeof commissionMeasurements.$inferSelect;

/**
 * What quoting tailors see instead of the measurements: per control dimension (EN 13402-3), the band of
 * body girths the wearer falls in, lower bound inclusive, upper exclusive, in millimetres.
 */
export const commissionSizeBand = pgTable(
	'commission_size_band',
	{
		commissionId: uuid('commission_id')
			.notNull()
			.references(() => commission.id, { onDelete: 'cascade' }),
		/** Measurement code: `bust_girth`, `waist_girth`, `hip_girth`. */
		dimension: text('dimension').notNull(),
		/** 1 for the primary dimension, 2 for the secondary. */
		position: integer('position').notNull(),
		lowerMm: integer('lower_mm').notNull(),
		upperMm: integer('upper_mm').notNull()
	},
	(t) => [
		primaryKey({ columns: [t.commissionId, t.dimension] }),
		index('commission_size_band_dimension_idx').on(t.dimension, t.lowerMm),
		check('commission_size_band_order', sql`${t.lowerMm} < ${t.upperMm}`)
	]
);
export type CommissionSizeBand = typeof commissionSizeBand.$inferSelect;
