import { bigserial, index, pgEnum, pgTable, unique, uuid } from 'drizzle-orm/pg-core';
import { createdAt } from './columns';

export const searchDocumentKind = pgEnum('search_document_kind', ['commission', 'workroom']);

/**
 * Documents whose search entry is out of step with the database. Written in the same transaction as the
 * change itself (a transactional outbox), so that no change is lost while search is away; the sync job
 * deletes a row once the index holds the document's current state.
 */
export const searchOutbox = pgTable(
	'search_outbox',
	{
		id: bigserial('id', { mode: 'number' }).primaryKey(),
		kind: searchDocumentKind('kind').notNull(),
		entityId: uuid('entity_id').notNull(),
		createdAt: createdAt()
	},
	(t) => [
		unique('search_outbox_kind_entity_uq').on(t.kind, t.entityId),
		index('search_outbox_created_idx').on(t.createdAt)
	]
);
export type SearchOutboxRow = typeof searchOutbox.$inferSelect;
export type SearchDocumentKind = (typeof searchDocumentKind.enumValues)[number];
