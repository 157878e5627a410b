import { z } from 'zod';

/** `GET /api/v1/health` (`HealthReport` in ./index). */
export const healthReportSchema = z
	.object({
		status: z.enum(['ok', 'degraded', 'down']).meta({
			description: '`down` when the database is; `degraded` while mail, jobs, storage, search or payments wait.'
		}),
		checks: z.object({
			database: z.enum(['ok', 'down']),
			mail: z.enum(['ok', 'degraded']),
			queue: z.enum(['ok', 'down']),
			storage: z.enum(['ok', 'degraded']),
			search: z
				.enum(['ok', 'degraded'])
				.meta({ description: 'When degraded, lists come from PostgreSQL instead: slower, still right.' }),
			payments: z
				.enum(['ok', 'degraded'])
				.meta({ description: 'The payment provider; degraded while it cannot be reached.' })
		}),
		details: z.record(z.string(), z.string()).optional().meta({ description: 'Error text, for administrators only.' })
	})
	.meta({ id: 'HealthReport' });
