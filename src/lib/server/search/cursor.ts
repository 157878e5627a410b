import { z } from 'zod';

/** Where a near-me list resumes: after this distance (whole metres) or publication time, then this id. */
export type ListKey = { distanceM: number; id: string } | { publishedMs: number; id: string };

const keySchema = z.union([
	z.object({ d: z.number().int().nonnegative(), id: z.uuid() }).strict(),
	z.object({ t: z.number().int().nonnegative(), id: z.uuid() }).strict()
]);

/** An opaque cursor: base64url JSON of the last key shown. Both the index and the database read the same one. */
export function encodeCursor(key: ListKey): string {
	const compact = 'distanceM' in key ? { d: key.distanceM, id: key.id } : { t: key.publishedMs, id: key.id };
	return Buffer.from(JSON.stringify(compact)).toString('base64url');
}

/** The key in a cursor, or null when it is not one of ours. */
export function decodeCursor(cursor: string): ListKey | null {
	try {
		const parsed = keySchema.safeParse(JSON.parse(Buffer.from(cursor, 'base64url').toString('utf8')));
		if (!parsed.success) return null;
		return 'd' in parsed.data
			? { distanceM: parsed.data.d, id: parsed.data.id }
			: { publishedMs: parsed.data.t, id: parsed.data.id };
	} catch {
		return null;
	}
}
