import { createDb } from '../../src/lib/server/db/client';

/** Direct database access for arranging test situations the UI has no button for yet. */
export function testDb() {
	const url = process.env.DATABASE_URL;
	if (!url) throw new Error('DATABASE_URL is not set; run the tests through `npm test`');
	return createDb(url, { max: 2 });
}
