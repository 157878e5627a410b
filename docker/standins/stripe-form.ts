/**
 * Stripe's request encoding: `application/x-www-form-urlencoded` with literal bracket nesting
 * (`line_items[0][price_data][currency]=usd`, `expand[]=latest_charge`, `metadata[order]=…`).
 * Decodes into nested objects and arrays of strings, as Stripe's API reads them.
 */
export type FormValue = string | FormValue[] | { [key: string]: FormValue };
export type FormObject = { [key: string]: FormValue };

export class FormDecodeError extends Error {
	constructor(readonly param: string) {
		super(`Invalid parameter: ${param}`);
	}
}

function splitKey(key: string): string[] {
	const open = key.indexOf('[');
	if (open <= 0) return [key];
	const segments = [key.slice(0, open)];
	const pattern = /\[([^\]]*)\]/g;
	let match: RegExpExecArray | null;
	let end = open;
	while ((match = pattern.exec(key)) && match.index === end) {
		segments.push(match[1]);
		end = pattern.lastIndex;
	}
	if (end !== key.length) throw new FormDecodeError(key);
	return segments;
}

/** Objects whose keys are all indices (`a[0]`, `a[1]` or `a[]`) become arrays, in index order. */
function arraysFromIndices(value: FormValue): FormValue {
	if (typeof value === 'string' || Array.isArray(value)) return value;
	const keys = Object.keys(value);
	for (const key of keys) value[key] = arraysFromIndices(value[key]);
	if (keys.length > 0 && keys.every((k) => /^\d+$/.test(k)))
		return keys.sort((a, b) => Number(a) - Number(b)).map((k) => value[k]);
	return value;
}

export function decodeForm(body: string): FormObject {
	const root: FormObject = {};
	const params = new URLSearchParams(body);
	const pushCounters = new Map<object, number>();
	for (const [rawKey, value] of params) {
		const segments = splitKey(rawKey);
		let node: { [key: string]: FormValue } = root;
		for (let i = 0; i < segments.length; i++) {
			let segment = segments[i];
			if (segment === '') {
				// `a[]=x`: the next free index.
				const next = pushCounters.get(node) ?? Object.keys(node).filter((k) => /^\d+$/.test(k)).length;
				pushCounters.set(node, next + 1);
				segment = String(next);
			}
			if (i === segments.length - 1) {
				if (typeof node[segment] === 'object') throw new FormDecodeError(rawKey);
				node[segment] = value;
			} else {
				const existing = node[segment];
				if (existing === undefined) node[segment] = {};
				else if (typeof existing === 'string') throw new FormDecodeError(rawKey);
				node = node[segment] as { [key: string]: FormValue };
			}
		}
	}
	return arraysFromIndices(root) as FormObject;
}
