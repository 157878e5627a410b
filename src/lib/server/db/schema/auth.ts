import { sql } from 'drizzle-orm';
import {
	bigint,
	index,
	integer,
	pgEnum,
	pgTable,
	primaryKey,
	text,
	timestamp,
	uniqueIndex,
	uuid,
	varchar
} from 'drizzle-orm/pg-core';
import { id, updatedAt, instant } from './columns';

export const userRole = pgEnum('user_role', ['customer', 'tailor', 'admin']);
export const lengthUnit = pgEnum('length_unit', ['in', 'cm']);

export const user = pgTable(
	'user',
	{
		id: id(),
		name: text('name'),
		email: text('email').notNull().unique(),
		emailVerified: instant('email_verified'),
		image: text('image'),
		passwordHash: text('password_hash'),
		role: userRole('role').notNull().default('customer'),
		units: lengthUnit('units').notNull().default('cm'),
		timeZone: text('time_zone').notNull().default('UTC'),
		suspendedAt: instant('suspended_at'),
		suspendedReason: text('suspended_reason'),
		// Millisecond precision, so a JavaScript Date round-trips exactly as a keyset-paging cursor.
		createdAt: timestamp('created_at', { withTimezone: true, mode: 'date', precision: 3 }).notNull().defaultNow(),
		updatedAt: updatedAt()
	},
	(t) => [
		index('user_role_idx').on(t.role),
		// One account per address whatever its case: lookups go through lower(email).
		uniqueIndex('user_email_lower_uq').on(sql`lower(${t.email})`),
		index('user_created_idx').on(t.createdAt, t.id)
	]
);
export type User = typeof user.$inferSelect;
export type NewUser = typeof user.$inferInsert;
export type UserRole = (typeof userRole.enumValues)[number];
export type LengthUnit = (typeof lengthUnit.enumValues)[number];

// The next three tables follow the shape @auth/drizzle-adapter expects.
export const account = pgTable(
	'account',
	{
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		type: text('type').$type<'email' | 'oauth' | 'oidc' | 'webauthn'>().notNull(),
		provider: text('provider').notNull(),
		providerAccountId: text('provider_account_id').notNull(),
		refresh_token: text('refresh_token'),
		access_token: text('access_token'),
		expires_at: integer('expires_at'),
		token_type: text('token_type'),
		scope: text('scope'),
		id_token: text('id_token'),
		session_state: text('session_state')
	},
	(t) => [primaryKey({ columns: [t.provider, t.providerAccountId] }), index('account_user_idx').on(t.userId)]
);

export const session = pgTable(
	'session',
	{
		sessionToken: text('session_token').primaryKey(),
		userId: uuid('user_id')
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		expires: instant('expires').notNull()
	},
	(t) => [index('session_user_idx').on(t.userId)]
);

export const verificationToken = pgTable(
	'verification_token',
	{
		identifier: text('identifier').notNull(),
		token: text('token').notNull(),
		expires: instant('expires').notNull()
	},
	(t) => [primaryKey({ columns: [t.identifier, t.token] })]
);

/** rate-limiter-flexible's PostgreSQL store (its own column layout): one row per limited key. */
export const rateLimit = pgTable('rate_limit', {
	key: varchar('key', { length: 255 }).primaryKey(),
	points: integer('points').notNull().default(0),
	expire: bigint('expire', { mode: 'number' })
});
