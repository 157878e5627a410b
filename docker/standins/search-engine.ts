import MiniSearch from 'minisearch';
import { compileFilter, FilterError, haversineMetres, type Doc, type Filter } from './search-filter';

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

	/** Documents with a point, by latitude: a radius filter then reads a band of them instead of every one. */
	private byLatitude: { lat: number; key: string }[] | null = null;

	private touch() {
		this.updatedAt = new Date().toISOString();
		this.text = null;
		this.byLatitude = null;
	}

	/** Keys of documents whose latitude is within the radius's north–south reach (a superset of the matches). */
	private latitudeBand({ lat, metres }: { lat: number; metres: number }): string[] {
		this.byLatitude ??= [...this.documents]
			.map(([key, doc]) => ({ key, lat: Number((doc._geo as { lat?: unknown } | undefined)?.lat) }))
			.filter((entry) => Number.isFinite(entry.lat))
			.sort((a, b) => a.lat - b.lat);
		const reach = ((metres * 1.01) / 6_371_008.8) * (180 / Math.PI);
		const sorted = this.byLatitude;
		let low = 0;
		let high = sorted.length;
		while (low < high) {
			const middle = (low + high) >> 1;
			if (sorted[middle].lat < lat - reach) low = middle + 1;
			else high = middle;
		}
		const keys: string[] = [];
		for (let i = low; i < sorted.length && sorted[i].lat <= lat + reach; i++) keys.push(sorted[i].key);
		return keys;
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
			this.documents.set(key, before ? { ...before, ...doc } : doc);
		}
		this.touch();
	}

	deleteDocuments(ids: (string | number)[]) {
		for (const id of ids) this.documents.delete(String(id));
		this.touch();
	}

	deleteWhere(filter: Filter) {
		const match = this.compile(filter);
		for (const [id, doc] of this.documents) if (match(doc)) this.documents.delete(id);
		this.touch();
	}

	clear() {
		this.documents.clear();
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

	search(request: SearchRequest) {
		const started = performance.now();
		const match = this.compile(request.filter);
		const q = request.q?.trim() ?? '';
		let candidates: { key: string; doc: Doc; score: number; distance?: number; sortValues?: unknown[] }[];
		if (q) {
			candidates = this.textIndex()
				.search(q)
				.map((hit) => ({ key: String(hit.id), doc: this.documents.get(String(hit.id))!, score: hit.score }));
		} else if (match.within) {
			candidates = this.latitudeBand(match.within).map((key) => ({ key, doc: this.documents.get(key)!, score: 0 }));
		} else {
			candidates = [...this.documents].map(([key, doc]) => ({ key, doc, score: 0 }));
		}
		const filtered = candidates.filter((c) => c.doc && match(c.doc));

		let geoOrigin: { lat: number; lng: number } | null = null;
		const comparators: ((a: (typeof filtered)[number], b: (typeof filtered)[number]) => number)[] = [];
		for (const rule of request.sort ?? []) {
			const geo = geoSort.exec(rule);
			if (geo) {
				if (!this.settings.sortableAttributes.includes('_geo'))
					throw new SearchError('The `_geo` field is not sortable.', 'invalid_search_sort');
				const origin = { lat: Number(geo[1]), lng: Number(geo[2]) };
				geoOrigin = origin;
				const direction = geo[3] === 'asc' ? 1 : -1;
				// Each hit's distance is worked out once, not at every comparison of the sort.
				const distance = (c: { doc: Doc; distance?: number }) => (c.distance ??= distanceTo(c.doc, origin));
				comparators.push((a, b) => direction * (distance(a) - distance(b)));
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
			const value = (c: { doc: Doc; sortValues?: unknown[] }) => {
				c.sortValues ??= [];
				if (!(slot in c.sortValues)) c.sortValues[slot] = fieldValue(c.doc, field[1]);
				return c.sortValues[slot];
			};
			comparators.push((a, b) => direction * compareValues(value(a), value(b)));
		}
		comparators.push((a, b) => b.score - a.score);
		filtered.sort((a, b) => {
			for (const compare of comparators) {
				const result = compare(a, b);
				if (result !== 0) return result;
			}
			return 0;
		});

		const offset = request.offset ?? 0;
		const limit = request.limit ?? 20;
		const retrieve = request.attributesToRetrieve;
		const hits = filtered.slice(offset, offset + limit).map(({ doc }) => {
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
