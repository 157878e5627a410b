import type { Index, Meilisearch, Settings } from 'meilisearch';
import type { SearchDocumentKind } from '../db/schema';

/** The two indexes and how they are searched: filters and sorts the near-me lists use, words to match. */
export const indexes: Record<SearchDocumentKind, { uid: string; settings: Settings }> = {
	commission: {
		uid: 'commissions',
		settings: {
			searchableAttributes: ['title', 'styleNotes'],
			filterableAttributes: [
				'_geo',
				'garment',
				'fabricSource',
				'budgetMinMinor',
				'budgetMaxMinor',
				'dateNeededDay',
				'publishedAtMs'
			],
			sortableAttributes: ['_geo', 'publishedAtMs', 'id'],
			// The list's order is the sort asked for (distance or newest) before any text relevance.
			rankingRules: ['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness']
		}
	},
	workroom: {
		uid: 'workrooms',
		settings: {
			searchableAttributes: ['name', 'bio', 'town'],
			filterableAttributes: ['_geo', 'specialties'],
			sortableAttributes: ['_geo', 'id'],
			rankingRules: ['sort', 'words', 'typo', 'proximity', 'attribute', 'exactness']
		}
	}
};

/** Thrown when the engine answers a write task as failed. */
export class SearchTaskFailed extends Error {}

/** Waits for a write to be applied; the engine applies writes in the background. */
export async function applied(task: ReturnType<Index['addDocuments']>) {
	const done = await task.waitTask({ timeout: 30_000 });
	if (done.status !== 'succeeded')
		throw new SearchTaskFailed(`search task ${done.uid} ${done.status}: ${done.error?.message ?? ''}`);
}

function isIndexMissing(error: unknown) {
	return (error as { cause?: { code?: string } }).cause?.code === 'index_not_found';
}

/** Whether the index exists: a search engine restarted without its data has none, and must be rebuilt. */
export async function exists(client: Meilisearch, kind: SearchDocumentKind) {
	try {
		await client.index(indexes[kind].uid).getRawInfo();
		return true;
	} catch (error) {
		if (isIndexMissing(error)) return false;
		throw error;
	}
}

/** Creates the index if needed and applies its settings. */
export async function prepare(client: Meilisearch, kind: SearchDocumentKind) {
	const { uid, settings } = indexes[kind];
	if (!(await exists(client, kind))) await applied(client.createIndex(uid, { primaryKey: 'id' }));
	await applied(client.index(uid).updateSettings(settings));
}
