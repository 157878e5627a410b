/**
 * Reads an iCalendar file back (RFC 5545 §3.1: unfold continuation lines, then NAME;PARAM=V:VALUE), enough for tests
 * to check what calendar programs will see.
 */
export type IcsProperty = { name: string; params: Record<string, string>; value: string };
export type IcsComponent = { type: string; properties: IcsProperty[]; components: IcsComponent[] };

export function parseIcs(text: string): IcsComponent {
	const lines = text
		.replace(/\r\n[ \t]/g, '')
		.split(/\r\n/)
		.filter(Boolean);
	const root: IcsComponent = { type: 'ROOT', properties: [], components: [] };
	const stack = [root];
	for (const line of lines) {
		const colon = line.search(/:(?=(?:[^"]*"[^"]*")*[^"]*$)/);
		const [head, value] = [line.slice(0, colon), line.slice(colon + 1)];
		const [name, ...rawParams] = head.split(';');
		const params = Object.fromEntries(rawParams.map((p) => p.split('=') as [string, string]));
		const top = stack[stack.length - 1];
		if (name === 'BEGIN') {
			const child: IcsComponent = { type: value, properties: [], components: [] };
			top.components.push(child);
			stack.push(child);
		} else if (name === 'END') {
			if (top.type !== value) throw new Error(`END:${value} closes ${top.type}`);
			stack.pop();
		} else {
			top.properties.push({ name, params, value });
		}
	}
	if (stack.length !== 1) throw new Error('unterminated component');
	return root;
}

export function prop(component: IcsComponent, name: string): IcsProperty | undefined {
	return component.properties.find((p) => p.name === name);
}

export function find(component: IcsComponent, type: string): IcsComponent | undefined {
	return component.components.find((c) => c.type === type);
}
