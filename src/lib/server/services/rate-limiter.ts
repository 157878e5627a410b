import { RateLimiterPostgres } from 'rate-limiter-flexible';
import { pool } from '../db';

/** Created by a migration (drizzle/), so no limiter creates it at run time. */
const tableName = 'rate_limit';

const limiters = new Map<string, RateLimiterPostgres>();

/**
 * A counter kept in PostgreSQL (shared by every app process), `points` per `duration` seconds; one
 * instance per name. Consuming a point is one atomic statement.
 */
export function rateLimiter(name: string, rule: { points: number; duration: number }) {
	let found = limiters.get(name);
	if (!found) {
		found = new RateLimiterPostgres({
			storeClient: pool,
			tableName,
			tableCreated: true,
			keyPrefix: name,
			points: rule.points,
			duration: rule.duration,
			// One limiter sweeps rows that expired over an hour ago, every five minutes.
			clearExpiredByTimeout: limiters.size === 0
		});
		limiters.set(name, found);
	}
	return found;
}
