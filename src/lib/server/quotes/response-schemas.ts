import { z } from 'zod';
import { quoteStatus } from '../db/schema';

/* The JSON answers of /api/v1/quotes/… and /api/v1/commissions/{id}/quotes, as `quoteJson` and `accept` build them. */

const instant = z.iso.datetime();
const isoDay = z.iso.date();
const currency = z.string().length(3).meta({ description: 'ISO 4217 code.' });

export const quoteWarningResponse = z
	.object({
		code: z.enum(['after_date_needed', 'capacity_full']),
		message: z.string().meta({ description: 'A sentence the tailor can read.' })
	})
	.meta({ id: 'QuoteWarning', description: 'Something the tailor may want to reconsider; it never stops a quote.' });

/** A quote as its parties see it (`quoteJson` in the quotes area). */
export const quoteResponse = z
	.object({
		id: z.uuid(),
		commissionId: z.uuid(),
		tailorId: z.uuid(),
		priceMinor: z.int().meta({ description: 'In the currency’s minor unit (ISO 4217 exponent).' }),
		currency,
		deliveryDate: isoDay,
		fittings: z.int().meta({ description: 'Fittings included in the price.' }),
		fabricIncluded: z.boolean(),
		advanceMinor: z.int().meta({
			description:
				'The advance for materials, in minor units, paid to the tailor when the customer approves the fabric and deducted from the final payment; 0 for none.'
		}),
		message: z.string(),
		validUntil: instant,
		status: z.enum(quoteStatus.enumValues),
		declineReason: z.string().meta({ description: 'Why the customer declined; empty when no reason was given.' }),
		decidedAt: instant.nullable(),
		createdAt: instant,
		updatedAt: instant,
		warnings: z
			.array(quoteWarningResponse)
			.meta({ description: 'Filled in on the answers to sending and changing a quote; empty elsewhere.' })
	})
	.meta({ id: 'Quote' });

export const quoteListResponse = z.object({ items: z.array(quoteResponse) }).meta({
	id: 'QuoteList',
	description: 'The owner sees every quote, live first and then the history; a tailor their own.'
});

/** `POST /api/v1/quotes/{id}/accept` → 201: the order the acceptance made. */
export const acceptResponse = z
	.object({
		orderId: z.uuid(),
		status: z.literal('awaiting_payment'),
		commissionId: z.uuid(),
		quoteId: z.uuid(),
		tailorId: z.uuid(),
		priceMinor: z.int().meta({ description: 'The accepted price, in minor units.' }),
		platformFeeMinor: z.int().meta({ description: 'Tackline’s fee, rounded half up from the basis points.' }),
		tailorPayoutMinor: z.int().meta({ description: 'What the tailor is paid: price less fee.' }),
		advanceMinor: z.int().meta({
			description: 'The part of the payout paid early, when the customer approves the fabric; 0 for none.'
		}),
		platformFeeBasisPoints: z.int(),
		currency,
		dueDate: isoDay,
		declinedQuoteIds: z.array(z.uuid()).meta({ description: 'The other live quotes, declined by this acceptance.' })
	})
	.meta({ id: 'AcceptedQuote', description: 'The order awaiting payment that accepting a quote makes.' });
export type AcceptResponse = z.output<typeof acceptResponse>;
