import MiniSearch from 'minisearch';
import { compileFilter, FilterError, haversineMetres, type Doc, type Filter } from './search-filter';
import { GeoGrid } from './search-geo';

export interface Settings {
	searchableAttributes: string[];
	filterableAttributes: string[];
	sortableAttributes: string[];
	displayedAttributes: string[];
}

export interface SearchRequest {
	q?: string | null;
	filter?: Filter | null;
	sort?: string[] | null;
	facets?: string[] | null;
	limit?: number;
	offset?: number;
	attributesToRetrieve?: string[] | null;
}

export class SearchError extends Error {
	constructor(
		message: string,
		readonly code: string
	) {
		super(message);
	}
}

const defaultSettings = (): Settings => ({
	searchableAttributes: ['*'],
	filterableAttributes: [],
	sortableAttributes: [],
	displayedAttributes: ['*']
});

const geoSort = /^_geoPoint\(\s*(-?[\d.]+)\s*,\s*(-?[\d.]+)\s*\)\s*:\s*(asc|desc)$/;
const fieldSort = /^([\w.]+)\s*:\s*(asc|desc)$/;

function stringFields(doc: Doc, prefix = ''): string[] {
	return Object.entries(doc).flatMap(([key, value]) => {
		if (key === '_geo') return [];
		if (typeof value === 'string' || (Array.isArray(value) && value.every((v) => typeof v === 'string')))
			return [prefix + key];
		return [];
	});
}

function fieldValue(doc: Doc, field: string): unknown {
	if (!field.includes('.')) return doc[field];
	return field
		.split('.')
		.reduce<unknown>((v, part) => (v && typeof v === 'object' ? (v as Doc)[part] : undefined), doc);
}

/** One index: documents by primary key, a text index rebuilt lazily after writes, and its settings. */
export class SearchIndex {
	readonly createdAt = new Date().toISOString();
	updatedAt = this.createdAt;
	settings = defaultSettings();
	readonly documents = new Map<string, Doc>();
	private text: MiniSearch<Doc> | null = null;

	constructor(
		readonly uid: string,
		public primaryKey: string | null
	) {}

	describe() {
		return { uid: this.uid, primaryKey: this.primaryKey, createdAt: this.createdAt, updatedAt: this.updatedAt };
	}

	/** Documents with a point, in grid cells: a radius search reads the cells near it, not every document. */
	private readonly geo = new GeoGrid();
	/** Each key's place in insertion order (kept when a document is replaced), the engine's last tie-break. */
	private readonly order = new Map<string, number>();
	private nextOrder = 0;
	/** Text matches by query, until the next write: the same words asked again are not scored again. */
	private readonly textHits = new Map<string, Map<string, number>>();

	private touch() {
		this.updatedAt = new Date().toISOString();
		this.text = null;
		this.textHits.clear();
	}

	private put(key: string, doc: Doc) {
		this.documents.set(key, doc);
		if (!this.order.has(key)) this.order.set(key, this.nextOrder++);
		this.geo.set(key, doc);
	}

	private remove(key: string) {
		this.documents.delete(key);
		this.order.delete(key);
		this.geo.delete(key);
	}

	updateSettings(patch: Partial<Settings>) {
		for (const key of Object.keys(defaultSettings()) as (keyof Settings)[]) {
			if (patch[key] === undefined) continue;
			const value = patch[key];
			this.settings[key] = value === null ? defaultSettings()[key] : [...value];
		}
		this.touch();
	}

	addDocuments(docs: Doc[], options: { primaryKey?: string; merge: boolean }) {
		if (!this.primaryKey) {
			this.primaryKey = options.primaryKey ?? Object.keys(docs[0] ?? {}).find((key) => /id$/i.test(key)) ?? null;
			if (!this.primaryKey)
				throw new SearchError(
					'The primary key inference failed: no attribute ends with `id`.',
					'index_primary_key_no_candidate_found'
				);
		}
		for (const doc of docs) {
			const id = doc[this.primaryKey];
			if (typeof id !== 'string' && typeof id !== 'number')
				throw new SearchError(`Document doesn't have a \`${this.primaryKey}\` attribute.`, 'missing_document_id');
			const key = String(id);
			const before = options.merge ? this.documents.get(key) : undefined;
			this.put(key, before ? { ...before, ...doc } : doc);
		}
		this.touch();
	}

	deleteDocuments(ids: (string | number)[]) {
		for (const id of ids) this.remove(String(id));
		this.touch();
	}

	deleteWhere(filter: Filter) {
		const match = this.compile(filter);
		for (const [id, doc] of [...this.documents]) if (match(doc)) this.remove(id);
		this.touch();
	}

	clear() {
		this.documents.clear();
		this.order.clear();
		this.geo.clear();
		this.touch();
	}

	private compile(filter: Filter | null | undefined) {
		try {
			return compileFilter(filter, this.settings.filterableAttributes);
		} catch (error) {
			if (error instanceof FilterError) throw new SearchError(error.message, 'invalid_search_filter');
			throw error;
		}
	}

	private textIndex() {
		if (this.text) return this.text;
		const searchable = this.settings.searchableAttributes;
		const fields = searchable.includes('*')
			? [...new Set([...this.documents.values()].flatMap((doc) => stringFields(doc)))]
			: searchable;
		this.text = new MiniSearch<Doc>({
			idField: '__key',
			fields,
			extractField: (doc, field) => {
				const value = fieldValue(doc, field);
				return Array.isArray(value) ? value.map(asText).join(' ') : asText(value);
			},
			searchOptions: { prefix: true, fuzzy: 0.2, combineWith: 'AND' }
		});
		this.text.addAll([...this.documents].map(([key, doc]) => ({ ...doc, __key: key })));
		return this.text;
	}

	/** Scores of the documents matching `q`, by key; remembered until the next write. */
	private matchText(q: string) {
		let hits = this.textHits.get(q);
		if (!hits) {
			hits = new Map(
				this.textIndex()
					.search(q)
					.map((hit) => [String(hit.id), hit.score])
			);
			if (this.textHits.size >= 64) this.textHits.delete(this.textHits.keys().next().value!);
			this.textHits.set(q, hits);
		}
		return hits;
	}

	/**
	 * Filters first (a required radius through the grid, then the other conditions on what is inside it),
	 * then text, then keeps only the first `offset + limit` in sort order instead of sorting every match.
	 */
	search(request: SearchRequest) {
		const started = performance.now();
		const match = this.compile(request.filter);
		const q = request.q?.trim() ?? '';
		const scores = q ? this.matchText(q) : null;
		const filtered: Candidate[] = [];
		const keep = (key: string, doc: Doc, test: (doc: Doc) => boolean, distance?: number) => {
			let score = 0;
			if (scores) {
				const scored = scores.get(key);
				if (scored === undefined) return;
				score = scored;
			}
			if (!test(doc)) return;
			filtered.push({
				key,
				doc,
				score,
				order: this.order.get(key)!,
				distance,
				origin: distance === undefined ? null : match.within!
			});
		};
		if (match.within) {
			const rest = match.rest!;
			this.geo.within(match.within, match.within.metres, (entry, metres) => keep(entry.key, entry.doc, rest, metres));
		} else if (scores) {
			for (const key of scores.keys()) {
				const doc = this.documents.get(key);
				if (doc) keep(key, doc, match);
			}
		} else {
			for (const [key, doc] of this.documents) keep(key, doc, match);
		}

		let geoOrigin: { lat: number; lng: number } | null = null;
		const comparators: ((a: Candidate, b: Candidate) => number)[] = [];
		for (const rule of request.sort ?? []) {
			const geo = geoSort.exec(rule);
			if (geo) {
				if (!this.settings.sortableAttributes.includes('_geo'))
					throw new SearchError('The `_geo` field is not sortable.', 'invalid_search_sort');
				const origin = { lat: Number(geo[1]), lng: Number(geo[2]) };
				geoOrigin = origin;
				const direction = geo[3] === 'asc' ? 1 : -1;
				// Each hit's distance is worked out once (or taken from the radius filter when it has the same centre).
				for (const c of filtered)
					c.sortDistance = sameCentre(c.origin, origin) ? c.distance! : distanceTo(c.doc, origin);
				comparators.push((a, b) => direction * (a.sortDistance! - b.sortDistance!) || 0);
				continue;
			}
			const field = fieldSort.exec(rule);
			if (!field) throw new SearchError(`Invalid syntax for the sort parameter: \`${rule}\`.`, 'invalid_search_sort');
			if (!this.settings.sortableAttributes.includes(field[1]))
				throw new SearchError(
					`Attribute \`${field[1]}\` is not sortable. Available sortable attributes are: \`${this.settings.sortableAttributes.join(', ')}\`.`,
					'invalid_search_sort'
				);
			const direction = field[2] === 'asc' ? 1 : -1;
			// Read once per hit and rule, not at every comparison.
			const slot = comparators.length;
			for (const c of filtered) (c.sortValues ??= [])[slot] = fieldValue(c.doc, field[1]);
			comparators.push((a, b) => direction * compareValues(a.sortValues![slot], b.sortValues![slot]));
		}
		comparators.push((a, b) => b.score - a.score);
		comparators.push((a, b) => a.order - b.order);
		const compare = (a: Candidate, b: Candidate) => {
			for (const comparator of comparators) {
				const result = comparator(a, b);
				if (result !== 0) return result;
			}
			return 0;
		};

		const offset = request.offset ?? 0;
		const limit = request.limit ?? 20;
		const retrieve = request.attributesToRetrieve;
		const hits = firstInOrder(filtered, offset + limit, compare)
			.slice(offset)
			.map(({ doc }) => {
				const shown: Doc =
					retrieve && !retrieve.includes('*')
						? Object.fromEntries(retrieve.filter((k) => k in doc).map((k) => [k, doc[k]]))
						: { ...doc };
				if (geoOrigin && doc._geo) shown._geoDistance = Math.round(distanceTo(doc, geoOrigin));
				return shown;
			});
		return {
			hits,
			query: q,
			processingTimeMs: Math.round(performance.now() - started),
			limit,
			offset,
			estimatedTotalHits: filtered.length,
			...(request.facets?.length
				? {
						facetDistribution: this.facets(
							request.facets,
							filtered.map((c) => c.doc)
						)
					}
				: {})
		};
	}

	private facets(names: string[], docs: Doc[]) {
		const distribution: Record<string, Record<string, number>> = {};
		for (const name of names) {
			if (!this.settings.filterableAttributes.includes(name))
				throw new SearchError(
					`Attribute \`${name}\` is not filterable, so it cannot be a facet.`,
					'invalid_search_facets'
				);
			const counts: Record<string, number> = {};
			for (const doc of docs) {
				const value = fieldValue(doc, name);
				for (const v of Array.isArray(value) ? value : value === undefined || value === null ? [] : [value])
					counts[asText(v)] = (counts[asText(v)] ?? 0) + 1;
			}
			distribution[name] = counts;
		}
		return distribution;
	}
}

type Candidate = {
	key: string;
	doc: Doc;
	score: number;
	/** Insertion order, the last tie-break. */
	order: number;
	/** Metres from the radius filter's centre, when the grid found this hit. */
	distance?: number;
	origin: { lat: number; lng: number } | null;
	sortDistance?: number;
	sortValues?: unknown[];
};

const sameCentre = (a: { lat: number; lng: number } | null, b: { lat: number; lng: number }) =>
	a !== null && a.lat === b.lat && a.lng === b.lng;

/**
 * The first `count` items in order: a bounded max-heap keeps the best seen so far, so n matches cost
 * O(n log count) comparisons, most of them one comparison against the heap's worst.
 */
export function firstInOrder<T>(items: T[], count: number, compare: (a: T, b: T) => number): T[] {
	if (count <= 0) return [];
	if (items.length <= count * 2) return items.sort(compare).slice(0, count);
	const heap: T[] = [];
	const down = (at: number) => {
		for (;;) {
			const left = 2 * at + 1;
			const right = left + 1;
			let worst = at;
			if (left < heap.length && compare(heap[left], heap[worst]) > 0) worst = left;
			if (right < heap.length && compare(heap[right], heap[worst]) > 0) worst = right;
			if (worst === at) return;
			[heap[at], heap[worst]] = [heap[worst], heap[at]];
			at = worst;
		}
	};
	for (const item of items) {
		if (heap.length < count) {
			heap.push(item);
			for (let at = heap.length - 1; at > 0;) {
				const parent = (at - 1) >> 1;
				if (compare(heap[at], heap[parent]) <= 0) break;
				[heap[at], heap[parent]] = [heap[parent], heap[at]];
				at = parent;
			}
		} else if (compare(item, heap[0]) < 0) {
			heap[0] = item;
			down(0);
		}
	}
	return heap.sort(compare);
}

function distanceTo(doc: Doc, origin: { lat: number; lng: number }) {
	const geo = doc._geo as { lat?: unknown; lng?: unknown } | undefined;
	if (!geo) return Number.POSITIVE_INFINITY;
	return haversineMetres(origin, { lat: Number(geo.lat), lng: Number(geo.lng) });
}

/** Numbers before strings, missing values last, as Meilisearch orders mixed fields. */
function compareValues(a: unknown, b: unknown): number {
	if (a === undefined || a === null) return b === undefined || b === null ? 0 : 1;
	if (b === undefined || b === null) return -1;
	if (typeof a === 'number' && typeof b === 'number') return a - b;
	if (typeof a === 'number') return -1;
	if (typeof b === 'number') return 1;
	return asText(a) < asText(b) ? -1 : asText(a) > asText(b) ? 1 : 0;
}

function asText(value: unknown): string {
	if (value === undefined || value === null) return '';
	if (typeof value === 'object') return JSON.stringify(value);
	return typeof value === 'string' ? value : `${value as number}`;
}
