import { readdirSync, readFileSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { Validator } from '@seriousme/openapi-schema-validator';
import { describe, expect, it } from 'vitest';
import { areas, openApi } from './index';
import { mergePaths, type Area } from './registry';

const methods = ['get', 'put', 'post', 'delete', 'patch', 'head', 'options'] as const;
const apiRoot = join(process.cwd(), 'src', 'routes', 'api', 'v1');

/** `[id=uuid]` → `{id}`, `(group)` dropped: the route folder as the document spells the path. */
function routePath(folder: string) {
	const segments = relative(join(process.cwd(), 'src', 'routes'), folder)
		.split(sep)
		.filter((segment) => !/^\(.+\)$/.test(segment))
		.map((segment) => segment.replace(/^\[(?:\.\.\.)?([\w]+)(?:=\w+)?\]$/, '{$1}'));
	return `/${segments.join('/')}`;
}

/** Every method handler exported by a `+server.ts` under src/routes/api/v1, as `GET /api/v1/…`. */
function routeOperations(folder = apiRoot): string[] {
	return readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
		const path = join(folder, entry.name);
		if (entry.isDirectory()) return routeOperations(path);
		if (entry.name !== '+server.ts') return [];
		const source = readFileSync(path, 'utf8');
		const exported = [
			...source.matchAll(/export\s+(?:const|(?:async\s+)?function)\s+(GET|PUT|POST|DELETE|PATCH|HEAD|OPTIONS)\b/g)
		];
		return exported.map(([, method]) => `${method} ${routePath(folder)}`);
	});
}

function documentOperations() {
	const { document } = openApi();
	return Object.entries(document.paths ?? {}).flatMap(([path, item]) =>
		methods.filter((method) => item[method]).map((method) => ({ key: `${method.toUpperCase()} ${path}`, path, method }))
	);
}

describe('the API document', () => {
	it('is a valid OpenAPI 3.1 document', async () => {
		const result = await new Validator().validate(
			structuredClone(openApi().document) as unknown as Parameters<Validator['validate']>[0]
		);
		expect(result.errors ?? [], JSON.stringify(result.errors, null, 1)).toEqual([]);
		expect(result.valid).toBe(true);
		expect(openApi().document.openapi).toBe('3.1.0');
	});

	it('has an operation for every handler under src/routes/api/v1, and no other', () => {
		const routes = routeOperations().sort();
		const documented = documentOperations()
			.map((op) => op.key)
			.sort();
		expect(routes.length).toBeGreaterThan(20);
		const missing = routes.filter((op) => !documented.includes(op));
		const extra = documented.filter((op) => !routes.includes(op));
		expect(
			missing,
			'endpoints with no operation in the document (register them in src/lib/server/openapi/paths/)'
		).toEqual([]);
		expect(extra, 'operations in the document that no +server.ts answers').toEqual([]);
	});

	it('describes every operation: a unique id, a summary, a known tag, who may call it and the error body', () => {
		const { document } = openApi();
		const tags = new Set(document.tags?.map((tag) => tag.name));
		const ids = new Set<string>();
		for (const { key, path, method } of documentOperations()) {
			const op = document.paths![path][method]!;
			expect(op.operationId, key).toBeTruthy();
			expect(ids.has(op.operationId!), `${key}: operationId ${op.operationId} is used twice`).toBe(false);
			ids.add(op.operationId!);
			expect(op.summary, key).toBeTruthy();
			expect(op.description, key).toMatch(/^(Public|Needs a signed-in session)/);
			expect(op.security, key).toBeDefined();
			expect(
				op.tags?.every((tag) => tags.has(tag)),
				key
			).toBe(true);
			const statuses = Object.keys(op.responses ?? {});
			expect(
				statuses.some((status) => /^2\d\d$/.test(status)),
				`${key} has a success answer`
			).toBe(true);
			expect(statuses, `${key} documents the rate limit`).toContain('429');
			for (const status of statuses.filter((s) => /^4\d\d$/.test(s))) {
				expect(JSON.stringify(op.responses![status]), `${key} ${status}`).toContain('#/components/schemas/ApiError');
			}
			for (const match of path.matchAll(/\{(\w+)\}/g)) {
				const params = (op.parameters ?? []) as { in: string; name: string }[];
				expect(
					params.some((p) => p.in === 'path' && p.name === match[1]),
					`${key} declares {${match[1]}}`
				).toBe(true);
			}
		}
	});

	it('refuses a method registered by two areas', () => {
		const op = { responses: { '204': { description: 'Done.' } } };
		const one: Area = { tag: { name: 'One', description: '' }, paths: { '/x': { get: op } } };
		const two: Area = { tag: { name: 'Two', description: '' }, paths: { '/x': { post: op } } };
		expect(Object.keys(mergePaths([one, two])['/x'])).toEqual(['get', 'post']);
		expect(() => mergePaths([one, { ...two, paths: { '/x': { get: op } } }])).toThrow('GET /x is registered twice.');
		expect(areas.length).toBeGreaterThan(0);
	});
});
