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

/**
 * Whether any value a document holds at `attribute` passes `test`: a top-level field read directly (no
 * array made for a single value), a dotted path walked.
 */
function anyAt(attribute: string): (doc: Doc, test: (value: unknown) => boolean) => boolean {
	if (attribute.includes('.')) return (doc, test) => valuesAt(doc, attribute).some(test);
	return (doc, test) => {
		if (!(attribute in doc)) return false;
		const value = doc[attribute];
		return Array.isArray(value) ? value.some(test) : test(value);
	};
}

/** One comparison against a fixed operand, with the operand's number and lower-case form worked out once. */
function comparer(op: string, expected: string): (actual: unknown) => boolean {
	const number = Number(expected);
	const numeric = expected.trim() !== '' && Number.isFinite(number);
	const lower = expected.toLowerCase();
	return (actual) => {
		if (numeric && typeof actual === 'number') {
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
			const equal = String(actual).toLowerCase() === lower;
			return op === '=' ? equal : !equal;
		}
		return compare(actual, op, expected);
	};
}

/** A filter tree turned into closures once per search, so each document costs a few property reads. */
function compileNode(node: Node): (doc: Doc) => boolean {
	switch (node.kind) {
		case 'and': {
			const items = node.items.map(compileNode);
			return (doc) => {
				for (const item of items) if (!item(doc)) return false;
				return true;
			};
		}
		case 'or': {
			const items = node.items.map(compileNode);
			return (doc) => {
				for (const item of items) if (item(doc)) return true;
				return false;
			};
		}
		case 'not': {
			const item = compileNode(node.item);
			return (doc) => !item(doc);
		}
		case 'compare': {
			const any = anyAt(node.attribute);
			if (node.op === '!=') {
				const equal = comparer('=', node.value);
				return (doc) => !any(doc, equal);
			}
			const test = comparer(node.op, node.value);
			return (doc) => any(doc, test);
		}
		case 'range': {
			const any = anyAt(node.attribute);
			const from = comparer('>=', node.from);
			const to = comparer('<=', node.to);
			const test = (v: unknown) => from(v) && to(v);
			return (doc) => any(doc, test);
		}
		case 'in': {
			const any = anyAt(node.attribute);
			const tests = node.values.map((value) => comparer('=', value));
			const test = (v: unknown) => tests.some((t) => t(v));
			return (doc) => any(doc, test);
		}
		case 'exists':
			return (doc) => valuesAt(doc, node.attribute).length > 0;
		case 'null':
			return (doc) => valuesAt(doc, node.attribute).some((v) => v === null);
		case 'empty': {
			const parts = node.attribute.split('.');
			return (doc) => {
				const raw = parts.reduce<unknown>(
					(value, part) => (value && typeof value === 'object' ? (value as Doc)[part] : undefined),
					doc
				);
				return raw === '' || (typeof raw === 'object' && raw !== null && Object.keys(raw).length === 0);
			};
		}
		case 'geoRadius': {
			const centre = { lat: node.lat, lng: node.lng };
			return (doc) => {
				const geo = doc._geo as { lat?: unknown; lng?: unknown } | undefined;
				if (!geo || geo.lat === undefined || geo.lng === undefined) return false;
				return haversineMetres(centre, { lat: Number(geo.lat), lng: Number(geo.lng) }) <= node.metres;
			};
		}
	}
}

/**
 * A compiled filter. `within` is a radius every match lies in, when the filter requires one; `rest` then
 * tests the other conditions only, for an engine that has already kept the documents inside that radius.
 */
export type Predicate = ((doc: Doc) => boolean) & {
	within?: { lat: number; lng: number; metres: number };
	rest?: (doc: Doc) => boolean;
};

const always = () => true;

/** The radius the whole filter requires (itself, or one term of a top-level AND), and the other terms. */
function requiredRadius(node: Node): { within: NonNullable<Predicate['within']>; rest: Node[] } | undefined {
	if (node.kind === 'geoRadius') return { within: { lat: node.lat, lng: node.lng, metres: node.metres }, rest: [] };
	if (node.kind === 'and') {
		const at = node.items.findIndex((item) => item.kind === 'geoRadius');
		if (at >= 0) {
			const geo = node.items[at] as Extract<Node, { kind: 'geoRadius' }>;
			return {
				within: { lat: geo.lat, lng: geo.lng, metres: geo.metres },
				rest: node.items.filter((_, i) => i !== at)
			};
		}
	}
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
	const node = flatten(new Parser(tokenize(text)).parse());
	for (const attribute of attributesOf(node)) {
		if (!filterable.includes(attribute))
			throw new FilterError(
				`Attribute \`${attribute}\` is not filterable. Available filterable attributes are: \`${filterable.join(', ')}\`.`
			);
	}
	const predicate: Predicate = compileNode(node);
	const required = requiredRadius(node);
	if (required) {
		predicate.within = required.within;
		predicate.rest = required.rest.length ? compileNode({ kind: 'and', items: required.rest }) : always;
	}
	return predicate;
}

/** Nested ANDs (the array form wraps each part in parentheses) as one level, so a radius inside is found. */
function flatten(node: Node): Node {
	if (node.kind === 'and') {
		const items = node.items.map(flatten).flatMap((item) => (item.kind === 'and' ? item.items : [item]));
		return items.length === 1 ? items[0] : { kind: 'and', items };
	}
	if (node.kind === 'or') {
		const items = node.items.map(flatten);
		return items.length === 1 ? items[0] : { kind: 'or', items };
	}
	if (node.kind === 'not') return { kind: 'not', item: flatten(node.item) };
	return node;
}
