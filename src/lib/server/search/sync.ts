import type { Meilisearch } from 'meilisearch';
import * as commissions from '../commissions';
import * as freshness from '../freshness';
import type { Executor } from '../db';
import type { SearchDocumentKind } from '../db/schema';
import * as outbox from '../search-outbox';
import { search } from '../services/search';
import * as workrooms from '../workrooms';
import { applied, exists, indexes, prepare } from './indexes';
import { reachable } from './nearby';

type Document = { id: string };

/** Reads documents through the area that owns them: never their tables from here. */
const sources: Record<
	SearchDocumentKind,
	{
		byIds: (db: Executor, ids: string[]) => Promise<Document[]>;
		page: (db: Executor, options: { afterId?: string; limit?: number }) => Promise<Document[]>;
	}
> = {
	commission: {
		byIds: commissions.searchDocuments.searchDocuments,
		page: commissions.searchDocuments.allSearchDocuments
	},
	workroom: {
		byIds: workrooms.searchDocuments.searchDocuments,
		page: workrooms.searchDocuments.allSearchDocuments
	}
};

const kinds: SearchDocumentKind[] = ['commission', 'workroom'];

/** Rebuilds one index from PostgreSQL: settings, every document, and the removal of any left over. */
async function rebuild(db: Executor, client: Meilisearch, kind: SearchDocumentKind, batchSize = 1000) {
	await prepare(client, kind);
	const index = client.index(indexes[kind].uid);
	const startedAt = Date.now();
	let afterId: string | undefined;
	let total = 0;
	const seen = new Set<string>();
	for (;;) {
		const docs = await sources[kind].page(db, { afterId, limit: batchSize });
		if (docs.length === 0) break;
		await applied(index.addDocuments(docs, { primaryKey: 'id' }));
		for (const doc of docs) seen.add(doc.id);
		total += docs.length;
		afterId = docs.at(-1)!.id;
	}
	// Documents indexed before this rebuild that are no longer listed.
	const stale: string[] = [];
	for (let offset = 0; ; offset += 1000) {
		const page = await index.getDocuments<Document>({ offset, limit: 1000, fields: ['id'] });
		for (const doc of page.results) if (!seen.has(doc.id)) stale.push(doc.id);
		if (page.results.length < 1000) break;
	}
	if (stale.length) await applied(index.deleteDocuments(stale));
	// Lists answered from the index while it was being refilled may be kept: the count moves, they are dropped.
	await freshness.touch(db);
	return { kind, documents: total, removed: stale.length, ms: Date.now() - startedAt };
}

/**
 * `npm run search:reindex`: rebuilds both indexes from PostgreSQL. Notes written meanwhile stay in the
 * outbox for the next sync, so nothing changed during the rebuild is missed.
 */
export async function reindex(db: Executor, client: Meilisearch = search()) {
	const results = [];
	for (const kind of kinds) results.push(await rebuild(db, client, kind));
	return results;
}

/**
 * The search-sync job: brings an index back after the engine lost it, then applies every waiting note —
 * the current document for what is listed, a removal for what is not. A failure leaves the notes in place
 * and throws, so the job is retried with back-off; the minute cron starts again after an outage.
 */
export async function syncOutbox(db: Executor, client: Meilisearch = search(), { batch = 500 } = {}) {
	for (const kind of kinds) if (!(await exists(client, kind))) await rebuild(db, client, kind);
	reachable(client);
	let synced = 0;
	for (;;) {
		const notes = await outbox.pending(db, { limit: batch });
		if (notes.length === 0) break;
		for (const kind of kinds) {
			const ids = [...new Set(notes.filter((note) => note.kind === kind).map((note) => note.entityId))];
			if (ids.length === 0) continue;
			const docs = await sources[kind].byIds(db, ids);
			const listed = new Set(docs.map((doc) => doc.id));
			const index = client.index(indexes[kind].uid);
			if (docs.length) await applied(index.addDocuments(docs, { primaryKey: 'id' }));
			const gone = ids.filter((id) => !listed.has(id));
			if (gone.length) await applied(index.deleteDocuments(gone));
		}
		await outbox.clear(db, notes);
		synced += notes.length;
		if (notes.length < batch) break;
	}
	return synced;
}
