import { z } from 'zod';
import { garmentIds } from '$lib/drafting';
import { onboardingSteps } from '$lib/types/workroom';
import { portfolioItemResponse } from '../photos/response-schemas';

/* The JSON answers of /api/v1/workroom and /api/v1/tailors/{id}, as ./api.ts builds them. */

const garment = z.enum(garmentIds);
const perGarment = <T extends z.ZodType>(value: T) => z.partialRecord(garment, value);

export const onboardingResponse = z
	.object({
		complete: z.boolean(),
		missing: z.array(z.enum(onboardingSteps)).meta({ description: 'The steps still to do, in order.' })
	})
	.meta({ id: 'Onboarding' });

export const ownWorkroomResponse = z
	.object({
		id: z.uuid(),
		slug: z.string(),
		url: z.string().meta({ description: 'The public page’s path.' }),
		name: z.string(),
		bio: z.string(),
		specialties: z.array(garment),
		location: z.object({
			town: z.string(),
			district: z.string().nullable(),
			country: z.string().nullable(),
			lat: z.number(),
			lng: z.number()
		}),
		serviceRadiusKm: z.number(),
		leadTimes: perGarment(z.number()).meta({ description: 'Usual lead time in days, per garment.' }),
		capacity: z.int(),
		rates: z
			.object({
				hourlyRateMinor: z.int(),
				currency: z.string().length(3),
				labourHours: perGarment(z.number()),
				fabricMarkupPercent: z.number()
			})
			.nullable(),
		acceptingWork: z.boolean(),
		onboardedAt: z.iso.datetime().nullable()
	})
	.meta({ id: 'OwnWorkroom' });

export const workroomAnswer = z.object({ workroom: ownWorkroomResponse, onboarding: onboardingResponse });

export const publicWorkroomResponse = z
	.object({
		id: z.uuid(),
		slug: z.string(),
		url: z.string(),
		name: z.string(),
		bio: z.string(),
		specialties: z.array(z.object({ id: garment, name: z.string(), leadTimeDays: z.number().nullable() })),
		area: z
			.object({ town: z.string(), district: z.string().nullable(), country: z.string().nullable() })
			.meta({ description: 'The town, never the point on the map.' }),
		serviceRadiusKm: z.number(),
		acceptingWork: z.boolean(),
		memberSince: z.iso.datetime(),
		reviews: z.object({
			count: z.int(),
			averageHundredths: z.int().nullable().meta({ description: 'Average rating × 100 (1–5 stars).' })
		}),
		portfolio: z.array(portfolioItemResponse)
	})
	.meta({ id: 'PublicWorkroom' });
