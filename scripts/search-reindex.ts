/**
 * `npm run search:reindex`: rebuilds both search indexes (open commissions, workrooms taking work) from
 * PostgreSQL — settings, every document, and the removal of anything no longer listed. Needs
 * DATABASE_URL, MEILI_HOST and (unless the engine runs without one) MEILI_MASTER_KEY. Safe while the app
 * runs: changes made meanwhile wait in the outbox for the next sync.
 */
import './lib/kit-modules';
import { createDb } from '../src/lib/server/db/client';

const url = process.env.DATABASE_URL;
if (!url || !process.env.MEILI_HOST) {
	console.error('Usage: DATABASE_URL=… MEILI_HOST=http://127.0.0.1:7701 MEILI_MASTER_KEY=… npm run search:reindex');
	process.exit(1);
}

// Loaded after the hooks above are registered: domain code imports `$lib/…` and Kit modules.
const search = await import('../src/lib/server/search');
const { db, pool } = createDb(url, { max: 2 });
try {
	for (const result of await search.reindex(db))
		console.log(`${result.kind}: ${result.documents} documents indexed, ${result.removed} removed (${result.ms} ms)`);
} catch (error) {
	console.error(`Reindex failed: ${error instanceof Error ? error.message : String(error)}`);
	process.exitCode = 1;
} finally {
	await pool.end();
}
