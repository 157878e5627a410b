import { env } from '$env/dynamic/private';
import { Meilisearch } from 'meilisearch';

let configured: Meilisearch | null = null;

/** The configured search client: the local stand-in in development and tests, Meilisearch in production. */
export function search(): Meilisearch {
	if (configured) return configured;
	if (!env.MEILI_HOST) throw new Error('MEILI_HOST is not set');
	configured = new Meilisearch({
		host: env.MEILI_HOST,
		apiKey: env.MEILI_MASTER_KEY || undefined,
		// Search sits in the request path: fail fast and let callers fall back to PostgreSQL.
		timeout: 2000
	});
	return configured;
}

const checkCacheMs = 5000;
let lastCheck: { at: number; result: Promise<string> } | null = null;

async function ping(): Promise<string> {
	try {
		const health = await search().health();
		return health.status === 'available' ? 'ok' : String(health.status);
	} catch (error) {
		return error instanceof Error ? error.message : 'unreachable';
	}
}

/** `ok`, or why search cannot be used; remembered for a few seconds so health polls stay cheap. */
export function check(): Promise<string> {
	const now = Date.now();
	if (!lastCheck || now - lastCheck.at > checkCacheMs) lastCheck = { at: now, result: ping() };
	return lastCheck.result;
}
