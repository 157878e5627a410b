import { z } from 'zod';
import { garmentIds, isCurrencyCode, type GarmentId } from '$lib/drafting';
import { parseAmount } from '$lib/format/amount-input';
import { text } from '../forms';

export const limits = {
	nameMax: 80,
	bioMax: 2000,
	bioMin: 20,
	radiusKm: [1, 200],
	capacity: [1, 50],
	leadTimeDays: [1, 365],
	labourHours: [0.25, 500],
	markupPercent: [0, 500],
	hourlyRateMinorMax: 100_000_000
} as const;

const name = text({
	min: 2,
	max: limits.nameMax,
	tooShort: 'Give your workroom a name of at least 2 characters.',
	tooLong: `Keep the name to ${limits.nameMax} characters.`
});
const bio = text({
	max: limits.bioMax,
	multiline: true,
	tooLong: `Keep the description to ${limits.bioMax} characters.`
});
const garment = z.enum(garmentIds, { error: 'Choose garments from the list.' });
const between = ([min, max]: readonly [number, number], message: string) =>
	z.number({ error: message }).min(min, message).max(max, message);
const wholeBetween = (range: readonly [number, number], message: string) => between(range, message).int(message);

const radius = wholeBetween(
	limits.radiusKm,
	`Choose a distance from ${limits.radiusKm[0]} to ${limits.radiusKm[1]} km.`
);
const capacity = wholeBetween(
	limits.capacity,
	`Say how many orders at once, from ${limits.capacity[0]} to ${limits.capacity[1]}.`
);
const leadTime = wholeBetween(limits.leadTimeDays, `Give a lead time from 1 to ${limits.leadTimeDays[1]} days.`);
const hours = between(
	limits.labourHours,
	`Give hours from ${limits.labourHours[0]} to ${limits.labourHours[1]}.`
).refine((value) => Number.isInteger(value * 4), 'Give hours in quarters of an hour (2, 2.25, 2.5…).');
const markup = wholeBetween(limits.markupPercent, `Give a mark-up from 0 to ${limits.markupPercent[1]} %.`);
const currency = z.string().refine(isCurrencyCode, 'Choose a currency (ISO 4217 code such as EUR).');
const hourlyRateMinor = z
	.number({ error: 'Give an hourly rate in minor units of the currency.' })
	.int('Give the rate in whole minor units (cents).')
	.positive('Give an hourly rate above zero.')
	.max(limits.hourlyRateMinorMax, 'That rate is too large.');

/** A place of the list by id (`geonames:…`, `local:…`), or a point that is named after the nearest place. */
export const locationChoice = z.union([
	z.strictObject({
		placeId: z.string().regex(/^(geonames:\d{1,10}|local:[\w-]{1,100})$/, 'Give a place id from GET /api/v1/places.')
	}),
	z.strictObject({ lat: z.number().min(-90).max(90), lng: z.number().min(-180).max(180) })
]);

const ratesSchema = z.strictObject({
	hourlyRateMinor,
	currency,
	labourHours: z.partialRecord(garment, hours).default({}),
	fabricMarkupPercent: markup.default(0)
});

/** The full onboarding fields, as `PUT /api/v1/workroom` replaces them. */
export const workroomReplace = z.strictObject({
	name,
	bio: bio.default(''),
	specialties: z.array(garment).max(garmentIds.length).default([]),
	location: locationChoice,
	serviceRadiusKm: radius,
	capacity,
	leadTimes: z.partialRecord(garment, leadTime).default({}),
	rates: ratesSchema.nullable().default(null)
});
export type WorkroomFields = z.output<typeof workroomReplace>;

/** Any subset of the fields: one section of the setup pages, or everything at once. */
export type WorkroomInput = Partial<WorkroomFields>;

// Forms send text: each section's schema reads the fields by name and gives the domain its input.

const typedNumber = <T extends z.ZodType<number, number>>(schema: T, missing: string) =>
	z
		.string({ error: missing })
		.trim()
		.min(1, missing)
		.transform((value, ctx) => {
			const number = Number(value.replace(',', '.'));
			if (!Number.isFinite(number)) {
				ctx.addIssue({ code: 'custom', message: 'Enter a number.' });
				return z.NEVER;
			}
			return number;
		})
		.pipe(schema);

export const basicsForm = z.object({
	name,
	serviceRadiusKm: typedNumber(radius, 'Say how far you travel or deliver, in km.'),
	capacity: typedNumber(capacity, 'Say how many orders you take on at once.')
});

export const aboutForm = z.object({
	bio: text({
		min: limits.bioMin,
		max: limits.bioMax,
		multiline: true,
		tooShort: `Write a sentence or two (at least ${limits.bioMin} characters) about your workroom.`,
		tooLong: `Keep the description to ${limits.bioMax} characters.`
	})
});

const checked = z.literal('on').optional();
const optionalText = z.string().optional().default('');

/** Specialties as one checkbox per garment (`make_<id>`), each with its lead time in days (`lead_<id>`). */
export const garmentsForm = z
	.object(
		Object.fromEntries(
			garmentIds.flatMap((id) => [
				[`make_${id}`, checked],
				[`lead_${id}`, optionalText]
			])
		) as Record<string, typeof checked | typeof optionalText>
	)
	.transform((fields, ctx) => {
		const specialties = garmentIds.filter((id) => fields[`make_${id}`] === 'on');
		if (specialties.length === 0) {
			ctx.addIssue({ code: 'custom', path: ['specialties'], message: 'Choose at least one garment you make.' });
		}
		const leadTimes: Partial<Record<GarmentId, number>> = {};
		for (const id of specialties) {
			const parsed = typedNumber(leadTime, 'Give a typical lead time in days.').safeParse(fields[`lead_${id}`]);
			if (parsed.success) leadTimes[id] = parsed.data;
			else ctx.addIssue({ code: 'custom', path: [`lead_${id}`], message: parsed.error.issues[0].message });
		}
		return { specialties, leadTimes };
	});

/** Rates for the quote helper; labour hours are asked for the workroom's specialties (`hours_<id>`). */
export function ratesForm(specialties: GarmentId[]) {
	return z
		.object({
			hourlyRate: z.string().optional().default(''),
			currency: z.string().optional().default(''),
			fabricMarkupPercent: typedNumber(markup, 'Give your mark-up on fabric you buy (0 if none).'),
			...Object.fromEntries(specialties.map((id) => [`hours_${id}`, optionalText]))
		})
		.transform((fields, ctx) => {
			const typed = (key: string) => {
				const value = (fields as Record<string, unknown>)[key];
				return typeof value === 'string' ? value.trim() : '';
			};
			const code = typed('currency').toUpperCase();
			const amount = parseAmount(typed('hourlyRate'), code);
			if (!isCurrencyCode(code)) ctx.addIssue({ code: 'custom', path: ['currency'], message: 'Choose a currency.' });
			else if (!typed('hourlyRate'))
				ctx.addIssue({ code: 'custom', path: ['hourlyRate'], message: 'Give your hourly rate.' });
			else if (!amount.ok) ctx.addIssue({ code: 'custom', path: ['hourlyRate'], message: amount.message });
			else if (amount.minor <= 0 || amount.minor > limits.hourlyRateMinorMax)
				ctx.addIssue({ code: 'custom', path: ['hourlyRate'], message: 'Give an hourly rate above zero.' });

			const labourHours: Partial<Record<GarmentId, number>> = {};
			for (const id of specialties) {
				const parsed = typedNumber(hours, 'Give the labour hours you usually spend.').safeParse(typed(`hours_${id}`));
				if (parsed.success) labourHours[id] = parsed.data;
				else ctx.addIssue({ code: 'custom', path: [`hours_${id}`], message: parsed.error.issues[0].message });
			}
			return {
				rates: {
					hourlyRateMinor: amount.ok ? amount.minor : 0,
					currency: code,
					labourHours,
					fabricMarkupPercent: fields.fabricMarkupPercent
				}
			};
		});
}
