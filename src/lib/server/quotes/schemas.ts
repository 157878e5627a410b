import { z } from 'zod';
import { isCurrencyCode } from '$lib/drafting';
import { parseAmount } from '$lib/format/amount-input';
import { advanceIssue, advanceLimitPercent } from '$lib/quotes/advance';
import { text } from '../forms';

/** The most a quote may ask, in minor units: far above any garment, well inside a 32-bit integer. */
export const maxPriceMinor = 100_000_000;
export const maxFittings = 10;
export const maxMessageLength = 4000;

const priceMinor = z
	.number({ error: 'Give the price as a whole number of minor units.' })
	.int('Give the price in whole minor units (cents, pence).')
	.positive('The price must be more than zero.')
	.max(maxPriceMinor, 'That price is beyond what Tackline takes for one garment.');

const currency = z
	.string({ error: 'Give the currency as an ISO 4217 code such as EUR.' })
	.trim()
	.toUpperCase()
	.refine(isCurrencyCode, 'Give the currency as an ISO 4217 code such as EUR.');

export const isoDate = z
	.string({ error: 'Give the date as YYYY-MM-DD.' })
	.regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.')
	.refine(
		(d) => !Number.isNaN(Date.parse(`${d}T00:00:00Z`)) && new Date(`${d}T00:00:00Z`).toISOString().startsWith(d),
		'That date does not exist.'
	);

/** The end of a calendar day (UTC): a quote "valid until 12 March" holds all that day. */
export function endOfDay(date: string) {
	return new Date(`${date}T23:59:59.999Z`);
}

/** A moment with its offset (`2027-03-12T18:00:00Z`), or a plain date meaning the end of that day (UTC). */
const validUntil = z.union(
	[isoDate.transform(endOfDay), z.iso.datetime({ offset: true }).transform((at) => new Date(at))],
	{ error: 'Give the date as YYYY-MM-DD or a moment such as 2027-03-12T18:00:00Z.' }
);

const fittings = z
	.number({ error: 'Give the number of fittings as a whole number.' })
	.int('Give the number of fittings as a whole number.')
	.min(0, 'Fittings cannot be negative.')
	.max(maxFittings, `At most ${maxFittings} fittings.`);

const message = text({ max: maxMessageLength, multiline: true });

const advanceMinor = z
	.number({ error: 'Give the advance as a whole number of minor units.' })
	.int('Give the advance in whole minor units (cents, pence).')
	.min(0, 'The advance cannot be negative.')
	.max(maxPriceMinor, 'That advance is beyond what Tackline takes for one garment.')
	.meta({
		description: `An advance for materials, paid to the tailor when the customer approves the fabric and deducted from the final payment: at most ${advanceLimitPercent} % of the price, and only when the fabric is included. 0 for none.`
	});

const terms = z.strictObject({
	priceMinor,
	currency,
	deliveryDate: isoDate,
	fittings,
	fabricIncluded: z.boolean({ error: 'Say whether the fabric is included (true or false).' }),
	message: message.default(''),
	validUntil,
	advanceMinor: advanceMinor.default(0)
});

/** The body of `POST /api/v1/commissions/{id}/quotes`. */
export const quoteCreate = terms.superRefine((body, ctx) => {
	const issue = advanceIssue(body);
	if (issue) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
});
export type QuoteCreate = z.output<typeof quoteCreate>;

/**
 * The body of `PATCH /api/v1/quotes/{id}`: any of the same fields, at least one. The advance is checked here
 * when the body carries everything it depends on, and against the quote's other terms when it is changed.
 */
export const quotePatch = terms
	.extend({ message, advanceMinor })
	.partial()
	.superRefine((body, ctx) => {
		if (Object.keys(body).length === 0) {
			ctx.addIssue({ code: 'custom', message: 'Send at least one field to change.' });
			return;
		}
		const { priceMinor, currency, fabricIncluded, advanceMinor } = body;
		if (!advanceMinor) return;
		// Whatever the body leaves out comes from the quote itself; `quotes.edit` checks the merged terms.
		if (fabricIncluded === false || (fabricIncluded && priceMinor !== undefined && currency !== undefined)) {
			const issue = advanceIssue({
				priceMinor: priceMinor ?? 0,
				currency: currency ?? '',
				advanceMinor,
				fabricIncluded
			});
			if (issue) ctx.addIssue({ code: 'custom', path: [issue.path], message: issue.message });
		}
	});
export type QuotePatch = z.output<typeof quotePatch>;

/** The longest reason a customer may give for declining a quote. */
export const declineReasonMax = 500;

/** `POST /api/v1/quotes/{id}/decline`: an optional reason the tailor is shown. */
export const declineRequestSchema = z
	.object({
		reason: z.string().trim().max(declineReasonMax, `Keep the reason to ${declineReasonMax} characters.`).optional()
	})
	.strict();
export type DeclineRequest = z.infer<typeof declineRequestSchema>;

/** `POST /api/v1/quotes/{id}/accept` takes no fields; a body, if sent, must be an empty object. */
export const acceptRequestSchema = z.object({}).strict();

const checkbox = z
	.union([z.literal('on'), z.literal('true'), z.literal('')])
	.optional()
	.transform((value) => value === 'on' || value === 'true');

const wholeNumber = (label: string, max: number) =>
	z
		.string()
		.trim()
		.regex(/^\d+$/, `Give ${label} as a whole number.`)
		.transform(Number)
		.pipe(z.number().max(max, `At most ${max} ${label}.`));

/**
 * The quote form: the price is typed in major units of the commission's currency ("85" or "85.50") and
 * becomes minor units here; `validUntil` is a date (valid through that whole day).
 */
export function quoteForm(currencyCode: string) {
	return z
		.object({
			price: z.string().trim().min(1, 'Give your price.'),
			deliveryDate: isoDate,
			fittings: wholeNumber('fittings', maxFittings),
			fabricIncluded: checkbox,
			message: text({ max: maxMessageLength, multiline: true }),
			validUntil: isoDate,
			advance: z.string().trim().max(20, 'Give the advance as an amount such as 60 or 60.50.').optional()
		})
		.transform((form, ctx) => {
			const amount = parseAmount(form.price, currencyCode);
			if (!amount.ok) {
				ctx.addIssue({ code: 'custom', path: ['price'], message: amount.message });
				return z.NEVER;
			}
			const checked = priceMinor.safeParse(amount.minor);
			if (!checked.success) {
				ctx.addIssue({ code: 'custom', path: ['price'], message: checked.error.issues[0].message });
				return z.NEVER;
			}
			// The advance field shows only while the fabric is included; a value left in it otherwise is not sent on.
			let advanceMinor = 0;
			if (form.fabricIncluded && form.advance) {
				const advance = parseAmount(form.advance, currencyCode);
				if (!advance.ok) {
					ctx.addIssue({ code: 'custom', path: ['advance'], message: advance.message });
					return z.NEVER;
				}
				advanceMinor = advance.minor;
				const issue = advanceIssue({
					priceMinor: checked.data,
					currency: currencyCode,
					advanceMinor,
					fabricIncluded: true
				});
				if (issue) {
					ctx.addIssue({ code: 'custom', path: ['advance'], message: issue.message });
					return z.NEVER;
				}
			}
			return {
				priceMinor: checked.data,
				currency: currencyCode,
				deliveryDate: form.deliveryDate,
				fittings: form.fittings,
				fabricIncluded: form.fabricIncluded,
				message: form.message,
				validUntil: endOfDay(form.validUntil),
				advanceMinor
			} satisfies QuoteCreate;
		});
}

/** The fields the quote form posts, for refilling it after a failure. */
export const quoteFormFields = [
	'price',
	'deliveryDate',
	'fittings',
	'fabricIncluded',
	'message',
	'validUntil',
	'advance',
	'fabricMetres',
	'fabricPrice',
	'labourHours',
	'hourlyRate',
	'markupPercent',
	'liningMetres',
	'liningPrice'
];
