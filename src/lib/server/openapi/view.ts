import type {
	DocsBody,
	DocsGroup,
	DocsOperation,
	DocsParameter,
	DocsResponse,
	DocsView,
	SchemaNode
} from '$lib/types/api-docs';
import type { OpenApiDocument } from './registry';

type Json = Record<string, unknown>;
type Schema = Json & {
	$ref?: string;
	type?: string | string[];
	anyOf?: Schema[];
	oneOf?: Schema[];
	allOf?: Schema[];
	properties?: Record<string, Schema>;
	required?: string[];
	additionalProperties?: Schema | boolean;
	propertyNames?: Schema;
	items?: Schema;
	prefixItems?: Schema[];
	enum?: unknown[];
};

const methodOrder = ['get', 'post', 'put', 'patch', 'delete', 'head', 'options'] as const;

const isNullSchema = (s: Schema) =>
	s.type === 'null' || (Array.isArray(s.enum) && s.enum.length === 1 && s.enum[0] === null);

function constraintsOf(s: Schema): string[] {
	const found: string[] = [];
	const n = (key: string) => {
		const value = s[key];
		return typeof value === 'number' ? value : undefined;
	};
	const [min, max, xmin, xmax] = [n('minimum'), n('maximum'), n('exclusiveMinimum'), n('exclusiveMaximum')];
	if (min !== undefined && max !== undefined) found.push(`${min} to ${max}`);
	else if (min !== undefined) found.push(`at least ${min}`);
	else if (max !== undefined) found.push(`at most ${max}`);
	if (xmin !== undefined) found.push(`above ${xmin}`);
	if (xmax !== undefined) found.push(`below ${xmax}`);
	const [minLength, maxLength] = [n('minLength'), n('maxLength')];
	if (minLength !== undefined && maxLength !== undefined)
		found.push(minLength === maxLength ? `exactly ${minLength} characters` : `${minLength} to ${maxLength} characters`);
	else if (maxLength !== undefined) found.push(`at most ${maxLength} characters`);
	else if (minLength !== undefined) found.push(`at least ${minLength} characters`);
	const [minItems, maxItems] = [n('minItems'), n('maxItems')];
	if (minItems !== undefined && maxItems !== undefined) found.push(`${minItems} to ${maxItems} items`);
	else if (maxItems !== undefined) found.push(`at most ${maxItems} items`);
	else if (minItems !== undefined) found.push(`at least ${minItems} items`);
	if (typeof s.pattern === 'string') found.push(`matches ${s.pattern}`);
	if (typeof s.contentMediaType === 'string') found.push(`content ${s.contentMediaType}`);
	if ('default' in s) found.push(`default ${JSON.stringify(s.default)}`);
	if ('const' in s) found.push(`always ${JSON.stringify(s.const)}`);
	return found;
}

/** A JSON Schema as a tree for the docs page; shared schemas stay references (rendered once, linked). */
export function schemaNode(input: unknown): SchemaNode {
	const s = (input ?? {}) as Schema;
	const description = typeof s.description === 'string' ? s.description : undefined;
	if (s.$ref) return { ref: s.$ref.split('/').at(-1), description, constraints: [] };
	const alternatives = s.anyOf ?? s.oneOf;
	if (alternatives) {
		const rest = alternatives.filter((option) => !isNullSchema(option));
		const nullable = rest.length < alternatives.length;
		const base = rest.length === 1 ? schemaNode(rest[0]) : null;
		if (base) {
			const extra = constraintsOf(s);
			return {
				...base,
				nullable: true,
				description: description ?? base.description,
				constraints: [...base.constraints, ...extra]
			};
		}
		return {
			description,
			nullable,
			constraints: constraintsOf(s),
			variants: { kind: s.oneOf ? 'one of' : 'any of', options: rest.map(schemaNode) }
		};
	}
	if (s.allOf)
		return {
			description,
			constraints: constraintsOf(s),
			variants: { kind: 'all of', options: s.allOf.map(schemaNode) }
		};
	const types = (Array.isArray(s.type) ? s.type : s.type ? [s.type] : []).filter((t) => t !== 'null');
	const node: SchemaNode = {
		type: types.length ? types.join(' or ') : undefined,
		format: typeof s.format === 'string' ? s.format : undefined,
		description,
		nullable: Array.isArray(s.type) && s.type.includes('null') ? true : undefined,
		constraints: constraintsOf(s)
	};
	if (Array.isArray(s.enum)) {
		node.enum = s.enum.filter((v) => v !== null).map((v) => JSON.stringify(v));
		if (s.enum.includes(null)) node.nullable = true;
	}
	if (s.properties) {
		const required = new Set(s.required ?? []);
		node.properties = Object.entries(s.properties).map(([name, schema]) => ({
			name,
			required: required.has(name),
			schema: schemaNode(schema)
		}));
	}
	if (s.additionalProperties === false) node.closed = true;
	else if (s.additionalProperties && typeof s.additionalProperties === 'object') {
		node.values = schemaNode(s.additionalProperties);
		if (s.propertyNames) node.keys = schemaNode(s.propertyNames);
	}
	if (s.prefixItems) node.tuple = s.prefixItems.map(schemaNode);
	else if (s.items) node.items = schemaNode(s.items);
	return node;
}

function bodies(content: unknown): DocsBody[] {
	return Object.entries((content ?? {}) as Record<string, { schema?: unknown }>).map(([contentType, media]) => ({
		contentType,
		schema: media.schema ? schemaNode(media.schema) : null
	}));
}

export const slugOf = (text: string) =>
	text
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-|-$/g, '');

/** The OpenAPI document as the docs page shows it: operations grouped by tag, in the document's tag order. */
export function docsView(document: OpenApiDocument): DocsView {
	const operations = new Map<string, DocsOperation[]>();
	for (const [path, item] of Object.entries(document.paths ?? {})) {
		for (const method of methodOrder) {
			const op = item[method];
			if (!op) continue;
			const parameters: DocsParameter[] = ((op.parameters ?? []) as unknown as Json[]).map((p) => ({
				name: String(p.name),
				in: String(p.in),
				required: Boolean(p.required),
				description: typeof p.description === 'string' ? p.description : undefined,
				schema: schemaNode(p.schema)
			}));
			const request = op.requestBody as { required?: boolean; content?: unknown } | undefined;
			const responses: DocsResponse[] = Object.entries(op.responses ?? {}).map(([status, response]) => ({
				status,
				description:
					typeof (response as Json).description === 'string' ? ((response as Json).description as string) : '',
				bodies: bodies((response as Json).content)
			}));
			const entry: DocsOperation = {
				id: op.operationId ?? slugOf(`${method} ${path}`),
				method: method.toUpperCase(),
				path,
				summary: op.summary ?? '',
				description: op.description ?? '',
				needsSession: (op.security ?? document.security ?? []).length > 0,
				parameters,
				requestBody: request ? { required: Boolean(request.required), bodies: bodies(request.content) } : null,
				responses
			};
			for (const tag of op.tags?.length ? op.tags : ['Other']) {
				operations.set(tag, [...(operations.get(tag) ?? []), entry]);
			}
		}
	}
	const declared = (document.tags ?? []).map((tag) => ({ name: tag.name, description: tag.description ?? '' }));
	const undeclared = [...operations.keys()]
		.filter((name) => !declared.some((tag) => tag.name === name))
		.map((name) => ({ name, description: '' }));
	const groups: DocsGroup[] = [...declared, ...undeclared]
		.filter((tag) => operations.has(tag.name))
		.map((tag) => ({
			tag: tag.name,
			slug: slugOf(tag.name),
			description: tag.description,
			operations: operations.get(tag.name)!
		}));
	const schemas = Object.entries(document.components?.schemas ?? {})
		.map(([name, schema]) => ({ name, schema: schemaNode(schema) }))
		.sort((a, b) => a.name.localeCompare(b.name));
	return {
		title: document.info.title,
		version: document.info.version,
		description: document.info.description ?? '',
		groups,
		schemas
	};
}
