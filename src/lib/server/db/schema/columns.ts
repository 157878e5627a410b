import { timestamp, uuid } from 'drizzle-orm/pg-core';

/** Every point in time is stored as timestamptz and read as a Date. */
export const instant = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

export const id = () => uuid('id').primaryKey().defaultRandom();

export const createdAt = () => instant('created_at').notNull().defaultNow();

export const updatedAt = () =>
	instant('updated_at')
		.notNull()
		.defaultNow()
		.$onUpdate(() => new Date());
