import { sql } from 'drizzle-orm';
import {
	bigint,
	boolean,
	char,
	check,
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

/** State of the tailor's connected payout account at the payment provider. */
export const payoutStatus = pgEnum('payout_status', ['not_connected', 'pending', 'enabled', 'restricted']);

// Keyed by the user id, so every `tailorId` elsewhere is both a user id and proof of a tailor profile.
export const tailorProfile = pgTable(
	'tailor_profile',
	{
		userId: uuid('user_id')
			.primaryKey()
			.references(() => user.id, { onDelete: 'cascade' }),
		shopName: text('shop_name').notNull(),
		slug: text('slug').notNull().unique(),
		bio: text('bio').notNull().default(''),
		/** Garment type ids from the catalogue in code. */
		specialties: text('specialties')
			.array()
			.notNull()
			.default(sql`'{}'::text[]`),
		/** ISO 3166-1 alpha-2 of the workroom's place. */
		countryCode: char('country_code', { length: 2 }),
		city: text('city').notNull(),
		district: text('district'),
		lat: doublePrecision('lat').notNull(),
		lng: doublePrecision('lng').notNull(),
		serviceRadiusKm: integer('service_radius_km').notNull().default(10),
		leadTimeDays: integer('lead_time_days').notNull().default(14),
		/** Typical lead time per garment id, in days; `lead_time_days` covers garments not listed. */
		leadTimes: jsonb('lead_times').$type<Record<string, number>>().notNull().default({}),
		/** The quote helper's rates: labour per hour in minor units of `rate_currency`. */
		hourlyRateMinor: bigint('hourly_rate_minor', { mode: 'number' }),
		rateCurrency: char('rate_currency', { length: 3 }),
		/** Default labour hours per garment id (decimals allowed: hours are not money). */
		labourHours: jsonb('labour_hours').$type<Record<string, number>>().notNull().default({}),
		/** Mark-up on fabric the workroom sources, in whole percent. */
		fabricMarkupPercent: integer('fabric_markup_percent').notNull().default(0),
		/** Set when every onboarding step is done; quoting needs it. Cleared if a required step is undone. */
		onboardedAt: instant('onboarded_at'),
		/** How many orders the workroom takes on at once. */
		capacity: integer('capacity').notNull().default(3),
		payoutAccountId: text('payout_account_id').unique(),
		payoutStatus: payoutStatus('payout_status').notNull().default('not_connected'),
		/** Cached from published reviews: 4.57 stars is stored as 457. */
		ratingAverageHundredths: integer('rating_average_hundredths').notNull().default(0),
		ratingCount: integer('rating_count').notNull().default(0),
		acceptingWork: boolean('accepting_work').notNull().default(true),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		index('tailor_profile_city_accepting_idx').on(t.city, t.acceptingWork),
		index('tailor_profile_location_idx').on(t.lat, t.lng),
		index('tailor_profile_specialties_idx').using('gin', t.specialties),
		check('tailor_profile_lat_range', sql`${t.lat} between -90 and 90`),
		check('tailor_profile_lng_range', sql`${t.lng} between -180 and 180`),
		check('tailor_profile_radius_positive', sql`${t.serviceRadiusKm} > 0`),
		check('tailor_profile_lead_time_nonnegative', sql`${t.leadTimeDays} >= 0`),
		check('tailor_profile_capacity_positive', sql`${t.capacity} > 0`),
		check('tailor_profile_rating_range', sql`${t.ratingAverageHundredths} between 0 and 500`),
		check('tailor_profile_rating_count_nonnegative', sql`${t.ratingCount} >= 0`),
		check('tailor_profile_rate_positive', sql`${t.hourlyRateMinor} > 0`),
		check('tailor_profile_rate_currency_iso', sql`${t.rateCurrency} ~ '^[A-Z]{3}$'`),
		check('tailor_profile_markup_range', sql`${t.fabricMarkupPercent} between 0 and 500`)
	]
);
export type TailorProfile = typeof tailorProfile.$inferSelect;
export type NewTailorProfile = typeof tailorProfile.$inferInsert;
export type PayoutStatus = (typeof payoutStatus.enumValues)[number];

/** One piece of work in a workroom's portfolio: a caption and its photos (`portfolio_photo`). */
export const portfolioItem = pgTable(
	'portfolio_item',
	{
		id: id(),
		tailorId: uuid('tailor_id')
			.notNull()
			.references(() => tailorProfile.userId, { onDelete: 'cascade' }),
		caption: text('caption').notNull().default(''),
		garmentType: text('garment_type'),
		sortOrder: integer('sort_order').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [index('portfolio_item_tailor_idx').on(t.tailorId, t.sortOrder)]
);
export type PortfolioItem = typeof portfolioItem.$inferSelect;
export type NewPortfolioItem = typeof portfolioItem.$inferInsert;

export const portfolioPhoto = pgTable(
	'portfolio_photo',
	{
		id: id(),
		itemId: uuid('item_id')
			.notNull()
			.references(() => portfolioItem.id, { onDelete: 'cascade' }),
		storageKey: text('storage_key').notNull().unique(),
		/** The 480 px re-encoded copy. */
		thumbKey: text('thumb_key').notNull().unique(),
		contentType: text('content_type').notNull(),
		bytes: integer('bytes').notNull(),
		width: integer('width').notNull(),
		height: integer('height').notNull(),
		altText: text('alt_text').notNull().default(''),
		sortOrder: integer('sort_order').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [
		index('portfolio_photo_item_idx').on(t.itemId, t.sortOrder),
		check('portfolio_photo_size_positive', sql`${t.bytes} > 0 and ${t.width} > 0 and ${t.height} > 0`)
	]
);
export type PortfolioPhoto = typeof portfolioPhoto.$inferSelect;
export type NewPortfolioPhoto = typeof portfolioPhoto.$inferInsert;
