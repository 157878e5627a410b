/** Fixed ids make the demo seed idempotent: a second run hits the same primary keys and inserts nothing. */
const kinds = { user: 1, measurementProfile: 2, commission: 3, quote: 4 } as const;

export function demoId(kind: keyof typeof kinds, n: number): string {
	const k = kinds[kind].toString(16).padStart(4, '0');
	return `5eed0000-0000-4000-8000-${k}${n.toString(16).padStart(8, '0')}`;
}
