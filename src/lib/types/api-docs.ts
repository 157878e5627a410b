/** A JSON Schema read for people: what /api/docs renders, built from the OpenAPI document on the server. */
export type SchemaNode = {
	/** Name of a shared schema, shown as a link to it instead of its body. */
	ref?: string;
	/** `object`, `array`, `string`, … or several joined with ` or `. */
	type?: string;
	format?: string;
	description?: string;
	nullable?: boolean;
	enum?: string[];
	/** "1 to 50", "at most 120 characters", "default 8", … */
	constraints: string[];
	properties?: { name: string; required: boolean; schema: SchemaNode }[];
	/** An object with free keys: what the keys and values are. */
	keys?: SchemaNode;
	values?: SchemaNode;
	closed?: boolean;
	items?: SchemaNode;
	tuple?: SchemaNode[];
	variants?: { kind: 'one of' | 'any of' | 'all of'; options: SchemaNode[] };
};

export type DocsParameter = { name: string; in: string; required: boolean; description?: string; schema: SchemaNode };

export type DocsBody = { contentType: string; schema: SchemaNode | null };

export type DocsResponse = { status: string; description: string; bodies: DocsBody[] };

export type DocsOperation = {
	id: string;
	method: string;
	path: string;
	summary: string;
	description: string;
	/** `public`, or the roles named in `security`/description. */
	needsSession: boolean;
	parameters: DocsParameter[];
	requestBody: { required: boolean; bodies: DocsBody[] } | null;
	responses: DocsResponse[];
};

export type DocsGroup = { tag: string; slug: string; description: string; operations: DocsOperation[] };

export type DocsView = {
	title: string;
	version: string;
	description: string;
	groups: DocsGroup[];
	schemas: { name: string; schema: SchemaNode }[];
};
