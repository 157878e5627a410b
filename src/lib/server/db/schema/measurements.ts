import { sql } from 'drizzle-orm';
import { check, jsonb, pgEnum, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt, updatedAt, instant } from './columns';
import { lengthUnit, user } from './auth';

/** Who took the measurements: the wearer alone, someone helping them, or a tailor. */
export const measurementTaker = pgEnum('measurement_taker', ['self', 'companion', 'tailor']);

/**
 * Body measurements in millimetres (kept to 0.01 mm, so inch eighths come back exactly), keyed by measurement code (`waist_girth`, …).
 * The vocabulary lives in the drafting module; the database only stores what it is given.
 */
export type MeasurementValuesMm = Record<string, number>;

export const measurementProfile = pgTable(
	'measurement_profile',
	{
		id: id(),
		// Measurements are personal data: they go when the account goes.
		ownerId: uuid('owner_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		label: text('label').notNull(),
		/** The unit the owner reads and types the values in; storage is always millimetres. */
		unit: lengthUnit('unit').notNull().default('cm'),
		valuesMm: jsonb('values_mm').$type<MeasurementValuesMm>().notNull().default({}),
		takenBy: measurementTaker('taken_by').notNull().default('self'),
		takenAt: instant('taken_at'),
		notes: text('notes').notNull().default(''),
		createdAt: createdAt(),
		updatedAt: updatedAt()
	},
	(t) => [
		unique('measurement_profile_owner_label_uq').on(t.ownerId, t.label),
		check('measurement_profile_values_object', sql`jsonb_typeof(${t.valuesMm}) = 'object'`)
	]
);
export type MeasurementProfile = typeof measurementProfile.$inferSelect;
export type NewMeasurementProfile = typeof measurementProfile.$inferInsert;
export type MeasurementTaker = (typeof measurementTaker.enumValues)[number];
