import { z } from 'zod';
import { garmentIds, isCurrencyCode, minorUnitExponent, parseMoney } from '$lib/drafting';
import { text } from '../forms';

export const garmentChoices = [...garmentIds, 'other'] as const;
export type GarmentChoice = (typeof garmentChoices)[number];

/** Every ISO 4217 code the runtime can format, for the currency list. */
export const currencies: readonly string[] = Intl.supportedValuesOf('currency').filter(isCurrencyCode);

const garment = z.enum(garmentChoices, { error: 'Choose a garment.' });
const garmentOther = text({ max: 80 });
const title = text({ min: 3, max: 120, tooShort: 'Give the commission a title of at least 3 characters.' });
const styleNotes = text({ max: 4000, multiline: true });
const fabricNotes = text({ max: 2000, multiline: true });
const fabricSource = z.enum(['customer_supplies', 'tailor_sources'], { error: 'Choose who brings the fabric.' });
const handover = z.enum(['pickup', 'delivery'], { error: 'Choose pickup or delivery.' });
const currency = z
	.string()
	.trim()
	.toUpperCase()
	.refine(isCurrencyCode, 'Choose a currency (ISO 4217 code such as EUR).');
const isoDate = z
	.string()
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.')
	.refine(
		(d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d),
		'That date does not exist.'
	);
const minor = z.number().int('Use whole minor units.').min(0, 'Amounts cannot be negative.').max(1_000_000_000);
const latitude = z.number().min(-90).max(90);
const longitude = z.number().min(-180).max(180);
const countryCode = z
	.string()
	.trim()
	.toUpperCase()
	.regex(/^[A-Z]{2}$/, 'Use a two-letter country code.');

/** What a draft may change, in storage units (minor units, ISO dates, degrees already coarsened). */
export type DraftChanges = Partial<{
	garmentType: GarmentChoice;
	garmentOther: string;
	title: string;
	styleNotes: string;
	measurementProfileId: string | null;
	fabricSource: 'customer_supplies' | 'tailor_sources';
	fabricNotes: string;
	budgetMinMinor: number;
	budgetMaxMinor: number;
	currency: string;
	dateNeeded: string;
	place: { lat: number; lng: number; city: string | null; district: string | null; countryCode: string | null };
	handover: 'pickup' | 'delivery';
}>;

const budget = z
	.object({ minMinor: minor, maxMinor: minor, currency })
	.refine((b) => b.minMinor <= b.maxMinor, {
		message: 'The lowest amount must not be above the highest.',
		path: ['minMinor']
	})
	.refine((b) => b.maxMinor > 0, { message: 'Give a budget above zero.', path: ['maxMinor'] });

const location = z.object({
	lat: latitude,
	lng: longitude,
	name: text({ max: 120 }).optional(),
	country: countryCode.optional()
});

/** The JSON API's fields (POST and PATCH /api/v1/commissions); PATCH takes any subset. */
const apiFields = {
	garment,
	garmentOther,
	title,
	styleNotes,
	measurementProfileId: z.uuid('Not a profile id.').nullable(),
	fabricSource,
	fabricNotes,
	budget,
	dateNeeded: isoDate,
	location,
	handover
};

export const apiPatch = z.strictObject(apiFields).partial();
export const apiCreate = apiPatch.required({ garment: true, title: true });
export type ApiPatch = z.output<typeof apiPatch>;

export function changesFromApi(body: ApiPatch): DraftChanges {
	const { garment: garmentType, budget: money, location: where, ...rest } = body;
	return {
		...rest,
		...(garmentType !== undefined ? { garmentType } : {}),
		...(money ? { budgetMinMinor: money.minMinor, budgetMaxMinor: money.maxMinor, currency: money.currency } : {}),
		...(where
			? {
					place: {
						lat: where.lat,
						lng: where.lng,
						city: where.name ?? null,
						district: null,
						countryCode: where.country ?? null
					}
				}
			: {})
	};
}

/* Forms: one schema per step, each field as the page names it. */

export const garmentForm = z
	.object({
		garment,
		garmentOther: garmentOther.optional().default(''),
		title,
		styleNotes: styleNotes.optional().default('')
	})
	.refine((f) => f.garment !== 'other' || f.garmentOther.length > 0, {
		message: 'Say what garment you would like.',
		path: ['garmentOther']
	});

export const measurementsForm = z.object({
	measurementProfileId: z.uuid('Choose one of your measurement profiles.')
});

export const fabricForm = z.object({ fabricSource, fabricNotes: fabricNotes.optional().default('') });

const moneyText = z.string().trim().max(20);

/** Typed amounts ("450", "60.50") converted with the currency's own number of decimals (JPY has none). */
export const budgetForm = z
	.object({ currency, budgetMin: moneyText, budgetMax: moneyText, dateNeeded: isoDate })
	.transform((form, ctx) => {
		const exponent = minorUnitExponent(form.currency);
		const read = (value: string, path: string) => {
			const amount = parseMoney(value.replace(/[\s,](?=\d{3}\b)/g, ''), form.currency);
			if (amount === null) {
				const decimals = exponent === 0 ? 'no decimals' : `up to ${exponent} decimals`;
				ctx.addIssue({
					code: 'custom',
					message: `Give an amount such as ${exponent ? '450.00' : '450'} (${decimals}).`,
					path: [path]
				});
			}
			return amount ?? 0;
		};
		const budgetMinMinor = read(form.budgetMin, 'budgetMin');
		const budgetMaxMinor = read(form.budgetMax, 'budgetMax');
		if (budgetMinMinor > budgetMaxMinor)
			ctx.addIssue({
				code: 'custom',
				message: 'The lowest amount must not be above the highest.',
				path: ['budgetMin']
			});
		else if (budgetMaxMinor === 0)
			ctx.addIssue({ code: 'custom', message: 'Give a budget above zero.', path: ['budgetMax'] });
		return { currency: form.currency, budgetMinMinor, budgetMaxMinor, dateNeeded: form.dateNeeded };
	});

export const handoverForm = z.object({ handover });

/** Minor units shown back in a form field, in the currency's own decimals. */
export function amountForInput(amountMinor: number | null, currencyCode: string) {
	if (amountMinor === null) return '';
	const exponent = minorUnitExponent(currencyCode);
	if (exponent === 0) return String(amountMinor);
	const digits = String(amountMinor).padStart(exponent + 1, '0');
	const whole = digits.slice(0, -exponent);
	const fraction = digits.slice(-exponent);
	return /^0+$/.test(fraction) ? whole : `${whole}.${fraction}`;
}
