import { z } from 'zod';
import { units } from '$lib/drafting';
import { checkResultSchema } from '$lib/drafting/response-schemas';
import { takers } from './schemas';

/** A measurement profile as `present` shows it: lengths in the profile's own unit. */
export const profileResponse = z
	.object({
		id: z.uuid(),
		label: z.string(),
		unit: z.enum(units),
		values: z.record(z.string(), z.number()).meta({ description: 'Lengths by measurement code, in `unit`.' }),
		checks: checkResultSchema,
		takenBy: z.enum(takers),
		takenAt: z.iso.date().nullable(),
		notes: z.string(),
		createdAt: z.iso.datetime(),
		updatedAt: z.iso.datetime()
	})
	.meta({ id: 'MeasurementProfile' });

export const profileListResponse = z.object({ items: z.array(profileResponse) });
