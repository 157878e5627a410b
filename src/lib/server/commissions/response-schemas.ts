import { z } from 'zod';
import { units } from '$lib/drafting';
import { commissionStatus } from '../db/schema';

/* The JSON answers of /api/v1/commissions/…, as `commissionJson` (routes/api/v1/commissions) shapes them. */

const instant = z.iso.datetime();
const isoDay = z.iso.date();

export const sizeBandRangeSchema = z
	.object({
		dimension: z.string().meta({ description: 'Measurement code, such as `hip_girth`.' }),
		lowerMm: z.number().meta({ description: 'Inclusive lower bound, millimetres.' }),
		upperMm: z.number().meta({ description: 'Exclusive upper bound, millimetres.' })
	})
	.meta({ id: 'SizeBandRange' });

export const budgetSchema = z
	.object({ minMinor: z.int(), maxMinor: z.int(), currency: z.string().length(3) })
	.meta({ id: 'Budget', description: 'Amounts in the currency’s minor unit (ISO 4217 exponent).' });

/**
 * A commission as the caller may see it: the owner has `measurements` and `measurementProfileId`; the awarded
 * tailor `measurements` and a fabric estimate; other tailors and administrators a fabric estimate alone.
 */
export const commissionResponse = z
	.object({
		id: z.uuid(),
		status: z.enum(commissionStatus.enumValues),
		garment: z.string().meta({ description: 'Garment id from GET /api/v1/garments, or `other`.' }),
		garmentOther: z.string(),
		title: z.string(),
		styleNotes: z.string(),
		fabricSource: z.enum(['customer_supplies', 'tailor_sources']),
		fabricNotes: z.string(),
		budget: budgetSchema.nullable(),
		dateNeeded: isoDay.nullable(),
		handover: z.enum(['pickup', 'delivery']),
		sizeBand: z.array(sizeBandRangeSchema),
		sizeBandText: z.string().nullable().meta({ description: 'The size band in the caller’s unit.' }),
		publishedAt: instant.nullable(),
		expiresAt: instant.nullable(),
		createdAt: instant,
		updatedAt: instant,
		photos: z
			.array(z.object({ id: z.uuid(), altText: z.string(), width: z.int(), height: z.int() }))
			.nullable()
			.meta({ description: 'Null when the caller may not see the photos.' }),
		customer: z.object({
			name: z.string().nullable().meta({ description: 'Full name for the owner; first name and initial for others.' })
		}),
		location: z
			.object({
				lat: z.number(),
				lng: z.number(),
				name: z.string().nullable(),
				district: z.string().nullable(),
				country: z.string().nullable()
			})
			.nullable()
			.meta({ description: 'Coarsened to about a kilometre.' }),
		measurementProfileId: z.uuid().nullable().optional().meta({ description: 'Owner only.' }),
		measurements: z
			.object({ unit: z.enum(units), values: z.record(z.string(), z.number()) })
			.nullable()
			.optional()
			.meta({
				description:
					'The frozen measurements in their own unit: for the owner and the tailor whose quote was accepted; absent for everyone else.'
			}),
		fabricEstimate: z
			.object({ length: z.string(), width: z.number(), unit: z.enum(units), folded: z.boolean() })
			.nullable()
			.optional()
			.meta({
				description:
					'For callers other than the owner (the awarded tailor included): fabric for the middle of the size band.'
			})
	})
	.meta({ id: 'Commission' });
