/**
 * The filter language of Meilisearch's search endpoint, as far as Tackline uses it: comparisons
 * (`= != > >= < <=`), ranges (`a 1 TO 5`), `IN [..]`, `EXISTS`, `IS NULL`, `IS EMPTY`, `NOT`, `AND`, `OR`,
 * parentheses and `_geoRadius(lat, lng, metres)`. The array form is an AND of ORs.
 */

export type Doc = Record<string, unknown>;
export type Filter = string | (string | string[])[];

type Node =
	| { kind: 'and' | 'or'; items: Node[] }
	| { kind: 'not'; item: Node }
	| { kind: 'compare'; attribute: string; op: '=' | '!=' | '>' | '>=' | '<' | '<='; value: string }
	| { kind: 'range'; attribute: string; from: string; to: string }
	| { kind: 'in'; attribute: string; values: string[] }
	| { kind: 'exists' | 'null' | 'empty'; attribute: string }
	| { kind: 'geoRadius'; lat: number; lng: number; metres: number };

export class FilterError extends Error {}

/** Great-circle metres on a sphere of the WGS-84 mean radius. */
export function haversineMetres(a: { lat: number; lng: number }, b: { lat: number; lng: number }) {
	const rad = Math.PI / 180;
	const dLat = (b.lat - a.lat) * rad;
	const dLng = (b.lng - a.lng) * rad;
	const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLng / 2) ** 2;
	return 2 * 6_371_008.8 * Math.asin(Math.min(1, Math.sqrt(h)));
}

function tokenize(text: string): string[] {
	const tokens: string[] = [];
	const pattern = /\s*(?:(>=|<=|!=|[=<>()[\],])|'((?:[^'\\]|\\.)*)'|"((?:[^"\\]|\\.)*)"|([^\s=<>!()[\],'"]+))/gy;
	let match: RegExpExecArray | null;
	let at = 0;
	while (at < text.length && (match = pattern.exec(text))) {
		at = pattern.lastIndex;
		if (match[1] !== undefined) tokens.push(match[1]);
		else if (match[2] !== undefined) tokens.push(`\u0000${match[2].replace(/\\(.)/g, '$1')}`);
		else if (match[3] !== undefined) tokens.push(`\u0000${match[3].replace(/\\(.)/g, '$1')}`);
		else if (match[4] !== undefined) tokens.push(match[4]);
		if (/^\s*$/.test(text.slice(at))) break;
	}
	if (at < text.length && !/^\s*$/.test(text.slice(at))) throw new FilterError(`Unexpected character at ${at}.`);
	return tokens;
}

/** Quoted tokens carry a NUL prefix so that `'AND'` stays a value, never the keyword. */
const literal = (token: string) => (token.startsWith('\u0000') ? token.slice(1) : token);
const isKeyword = (token: string | undefined, word: string) => token !== undefined && token.toUpperCase() === word;

class Parser {
	private at = 0;
	constructor(private readonly tokens: string[]) {}

	parse(): Node {
		const node = this.or();
		if (this.at < this.tokens.length) throw new FilterError(`Unexpected \`${literal(this.tokens[this.at])}\`.`);
		return node;
	}

	private peek() {
		return this.tokens[this.at];
	}

	private next(what: string) {
		const token = this.tokens[this.at++];
		if (token === undefined) throw new FilterError(`Expected ${what} at the end of the filter.`);
		return token;
	}

	private expect(token: string) {
		const got = this.next(`\`${token}\``);
		if (got !== token) throw new FilterError(`Expected \`${token}\`, found \`${literal(got)}\`.`);
	}

	private or(): Node {
		const items = [this.and()];
		while (isKeyword(this.peek(), 'OR')) {
			this.at++;
			items.push(this.and());
		}
		return items.length === 1 ? items[0] : { kind: 'or', items };
	}

	private and(): Node {
		const items = [this.not()];
		while (isKeyword(this.peek(), 'AND')) {
			this.at++;
			items.push(this.not());
		}
		return items.length === 1 ? items[0] : { kind: 'and', items };
	}

	private not(): Node {
		if (isKeyword(this.peek(), 'NOT')) {
			this.at++;
			return { kind: 'not', item: this.not() };
		}
		return this.primary();
	}

	private primary(): Node {
		const token = this.next('a condition');
		if (token === '(') {
			const node = this.or();
			this.expect(')');
			return node;
		}
		if (token === '_geoRadius') return this.geoRadius();
		const attribute = literal(token);
		const op = this.next('an operator');
		if (['=', '!=', '>', '>=', '<', '<='].includes(op))
			return { kind: 'compare', attribute, op: op as '=', value: literal(this.next('a value')) };
		if (isKeyword(op, 'IN')) return { kind: 'in', attribute, values: this.list() };
		if (isKeyword(op, 'EXISTS')) return { kind: 'exists', attribute };
		if (isKeyword(op, 'IS')) {
			const negated = isKeyword(this.peek(), 'NOT') && Boolean(++this.at);
			const what = this.next('NULL or EMPTY').toUpperCase();
			if (what !== 'NULL' && what !== 'EMPTY') throw new FilterError('Expected NULL or EMPTY after IS.');
			const node: Node = { kind: what === 'NULL' ? 'null' : 'empty', attribute };
			return negated ? { kind: 'not', item: node } : node;
		}
		if (isKeyword(op, 'NOT')) {
			const after = this.next('IN or EXISTS');
			if (isKeyword(after, 'IN')) return { kind: 'not', item: { kind: 'in', attribute, values: this.list() } };
			if (isKeyword(after, 'EXISTS')) return { kind: 'not', item: { kind: 'exists', attribute } };
			throw new FilterError('Expected IN or EXISTS after NOT.');
		}
		// `attribute from TO to`
		const from = literal(op);
		const to = this.next('TO');
		if (!isKeyword(to, 'TO')) throw new FilterError(`Expected an operator after \`${attribute}\`.`);
		return { kind: 'range', attribute, from, to: literal(this.next('a value')) };
	}

	private list(): string[] {
		this.expect('[');
		const values: string[] = [];
		while (this.peek() !== ']') {
			values.push(literal(this.next('a value')));
			if (this.peek() === ',') this.at++;
		}
		this.expect(']');
		return values;
	}

	private geoRadius(): Node {
		this.expect('(');
		const numbers: number[] = [];
		for (let i = 0; i < 3; i++) {
			numbers.push(Number(literal(this.next('a number'))));
			if (i < 2) this.expect(',');
		}
		this.expect(')');
		const [lat, lng, metres] = numbers;
		if (numbers.some((n) => !Number.isFinite(n)) || Math.abs(lat) > 90 || Math.abs(lng) > 180 || metres < 0)
			throw new FilterError('_geoRadius takes a latitude, a longitude and a distance in metres.');
		return { kind: 'geoRadius', lat, lng, metres };
	}
}

/** Attributes a filter names (`_geo` for a geo condition), to check against the filterable ones. */
function attributesOf(node: Node): string[] {
	switch (node.kind) {
		case 'and':
		case 'or':
			return node.items.flatMap(attributesOf);
		case 'not':
			return attributesOf(node.item);
		case 'geoRadius':
			return ['_geo'];
		default:
			return [node.attribute];
	}
}

function valuesAt(doc: Doc, attribute: string): unknown[] {
	let current: unknown[] = [doc];
	for (const part of attribute.split('.')) {
		current = current.flatMap((value) =>
			value && typeof value === 'object' && part in value ? [(value as Doc)[part]] : []
		);
	}
	return current.flatMap((value): unknown[] => (Array.isArray(value) ? (value as unknown[]) : [value]));
}

function compare(actual: unknown, op: string, expected: string): boolean {
	const number = Number(expected);
	if (typeof actual === 'number' && expected.trim() !== '' && Number.isFinite(number)) {
		switch (op) {
			case '=':
				return actual === number;
			case '!=':
				return actual !== number;
			case '>':
				return actual > number;
			case '>=':
				return actual >= number;
			case '<':
				return actual < number;
			case '<=':
				return actual <= number;
		}
	}
	if (op === '=' || op === '!=') {
		const equal = String(actual).toLowerCase() === expected.toLowerCase();
		return op === '=' ? equal : !equal;
	}
	// Meilisearch compares strings lexically for > and < (dates as ISO strings work that way).
	const a = String(actual);
	switch (op) {
		case '>':
			return a > expected;
		case '>=':
			return a >= expected;
		case '<':
			return a < expected;
		default:
			return a <= expected;
	}
}

function matches(node: Node, doc: Doc): boolean {
	switch (node.kind) {
		case 'and':
			return node.items.every((item) => matches(item, doc));
		case 'or':
			return node.items.some((item) => matches(item, doc));
		case 'not':
			return !matches(node.item, doc);
		case 'compare': {
			const values = valuesAt(doc, node.attribute);
			if (node.op === '!=') return !values.some((v) => compare(v, '=', node.value));
			return values.some((v) => compare(v, node.op, node.value));
		}
		case 'range':
			return valuesAt(doc, node.attribute).some((v) => compare(v, '>=', node.from) && compare(v, '<=', node.to));
		case 'in':
			return valuesAt(doc, node.attribute).some((v) => node.values.some((value) => compare(v, '=', value)));
		case 'exists':
			return valuesAt(doc, node.attribute).length > 0;
		case 'null':
			return valuesAt(doc, node.attribute).some((v) => v === null);
		case 'empty': {
			const raw = node.attribute
				.split('.')
				.reduce<unknown>((value, part) => (value && typeof value === 'object' ? (value as Doc)[part] : undefined), doc);
			return raw === '' || (typeof raw === 'object' && raw !== null && Object.keys(raw).length === 0);
		}
		case 'geoRadius': {
			const geo = doc._geo as { lat?: unknown; lng?: unknown } | undefined;
			if (!geo || geo.lat === undefined || geo.lng === undefined) return false;
			return haversineMetres(node, { lat: Number(geo.lat), lng: Number(geo.lng) }) <= node.metres;
		}
	}
}

/** A compiled filter; `within` is a radius every match lies in, when the filter requires one (for a prefilter). */
export type Predicate = ((doc: Doc) => boolean) & { within?: { lat: number; lng: number; metres: number } };

function requiredRadius(node: Node): Predicate['within'] {
	if (node.kind === 'geoRadius') return { lat: node.lat, lng: node.lng, metres: node.metres };
	if (node.kind === 'and') for (const item of node.items) if (item.kind === 'geoRadius') return requiredRadius(item);
	return undefined;
}

/** Parses a filter (string or array form) into a predicate, refusing attributes that are not filterable. */
export function compileFilter(filter: Filter | undefined | null, filterable: readonly string[]): Predicate {
	if (filter === undefined || filter === null || (Array.isArray(filter) && filter.length === 0)) return () => true;
	const text = Array.isArray(filter)
		? filter
				.map((part) => (Array.isArray(part) ? `(${part.map((p) => `(${p})`).join(' OR ')})` : `(${part})`))
				.join(' AND ')
		: filter;
	if (text.trim() === '') return () => true;
	const node = new Parser(tokenize(text)).parse();
	for (const attribute of attributesOf(node)) {
		if (!filterable.includes(attribute))
			throw new FilterError(
				`Attribute \`${attribute}\` is not filterable. Available filterable attributes are: \`${filterable.join(', ')}\`.`
			);
	}
	const predicate: Predicate = (doc) => matches(node, doc);
	predicate.within = requiredRadius(node);
	return predicate;
}
