import { index, jsonb, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { id, createdAt } from './columns';
import { user } from './auth';

/** Who did what to what, for admin and money actions. */
export const auditEvent = pgTable(
	'audit_event',
	{
		id: id(),
		// Null for system actions (jobs, webhooks), and the trail survives the actor's account.
		actorId: uuid('actor_id').references(() => user.id, { onDelete: 'set null' }),
		/** Dotted verb, e.g. 'order.release' or 'user.suspend'. */
		action: text('action').notNull(),
		subjectType: text('subject_type').notNull(),
		/** Text, not uuid: some subjects are identified by a provider's id. */
		subjectId: text('subject_id').notNull(),
		data: jsonb('data').$type<Record<string, unknown>>().notNull().default({}),
		ip: text('ip'),
		createdAt: createdAt()
	},
	(t) => [
		index('audit_event_subject_idx').on(t.subjectType, t.subjectId, t.createdAt),
		index('audit_event_created_idx').on(t.createdAt),
		index('audit_event_actor_idx').on(t.actorId, t.createdAt)
	]
);
export type AuditEvent = typeof auditEvent.$inferSelect;
export type NewAuditEvent = typeof auditEvent.$inferInsert;
