import { sql } from 'drizzle-orm';
import { char, check, doublePrecision, index, pgTable, text } from 'drizzle-orm/pg-core';
import { createdAt } from './columns';

/**
 * Places offered beside the gazetteer package: districts of a town it lists only as a whole, or the
 * invented demo city. Searched together with the gazetteer.
 */
export const localPlace = pgTable(
	'local_place',
	{
		/** Stable, chosen by whoever adds the place (`merrowgate-old-quay`). */
		id: text('id').primaryKey(),
		name: text('name').notNull(),
		/** The town or region it belongs to, shown after the name. */
		admin: text('admin').notNull().default(''),
		/** ISO 3166-1 alpha-2. */
		country: char('country', { length: 2 }).notNull(),
		lat: doublePrecision('lat').notNull(),
		lng: doublePrecision('lng').notNull(),
		createdAt: createdAt()
	},
	(t) => [
		index('local_place_name_idx').on(sql`lower(${t.name}) text_pattern_ops`),
		check('local_place_lat_range', sql`${t.lat} between -90 and 90`),
		check('local_place_lng_range', sql`${t.lng} between -180 and 180`),
		check('local_place_country_iso', sql`${t.country} ~ '^[A-Z]{2}$'`)
	]
);
export type LocalPlace = typeof localPlace.$inferSelect;
export type NewLocalPlace = typeof localPlace.$inferInsert;
