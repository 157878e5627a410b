import { sql } from 'drizzle-orm';
import { boolean, check, doublePrecision, index, integer, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt } from './columns';
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
		city: text('city').notNull(),
		district: text('district'),
		lat: doublePrecision('lat').notNull(),
		lng: doublePrecision('lng').notNull(),
		serviceRadiusKm: integer('service_radius_km').notNull().default(10),
		leadTimeDays: integer('lead_time_days').notNull().default(14),
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
		check('tailor_profile_rating_count_nonnegative', sql`${t.ratingCount} >= 0`)
	]
);
export type TailorProfile = typeof tailorProfile.$inferSelect;
export type NewTailorProfile = typeof tailorProfile.$inferInsert;
export type PayoutStatus = (typeof payoutStatus.enumValues)[number];

export const portfolioItem = pgTable(
	'portfolio_item',
	{
		id: id(),
		tailorId: uuid('tailor_id')
			.notNull()
			.references(() => tailorProfile.userId, { onDelete: 'cascade' }),
		storageKey: text('storage_key').notNull().unique(),
		caption: text('caption').notNull().default(''),
		garmentType: text('garment_type'),
		sortOrder: integer('sort_order').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [index('portfolio_item_tailor_idx').on(t.tailorId, t.sortOrder)]
);
export type PortfolioItem = typeof portfolioItem.$inferSelect;
export type NewPortfolioItem = typeof portfolioItem.$inferInsert;
