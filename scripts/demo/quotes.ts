import type { Executor } from '../../src/lib/server/db/client';
import { openThread } from '../../src/lib/server/messages/threads';
import { quote, type NewQuote } from '../../src/lib/server/db/schema';
import { currency } from './city';
import { demoId } from './ids';
import { personId } from './people';
import { dateFrom, daysFrom } from './time';

// Three offers on the demo customer's trousers, so the side-by-side comparison has something to show,
// and a few on other open commissions (one withdrawn, as history). The demo tailor has not quoted yet:
// that is theirs to try.
const trousers = demoId('commission', 1);
const shiftDress = demoId('commission', 4);
const felixTrousers = demoId('commission', 5);
const aLineSkirt = demoId('commission', 6);

export function demoQuotes(now: Date): NewQuote[] {
	return [
		{
			id: demoId('quote', 1),
			commissionId: trousers,
			tailorId: personId('tobiah.marsh@tackline.test'),
			priceMinor: 15800,
			deliveryDate: dateFrom(now, 38),
			fittingsIncluded: 1,
			fabricIncluded: true,
			message:
				'I have a washed sand linen on the shelf that would suit this. One fitting at the workroom once the trousers are tacked together.',
			validUntil: daysFrom(now, 14),
			createdAt: daysFrom(now, -2)
		},
		{
			id: demoId('quote', 2),
			commissionId: trousers,
			tailorId: personId('reuben.frost@tackline.test'),
			priceMinor: 17200,
			deliveryDate: dateFrom(now, 42),
			fittingsIncluded: 2,
			fabricIncluded: true,
			message:
				'Two fittings: the first in calico before I cut your linen, the second before hemming, so the length is right with your shoes on.',
			validUntil: daysFrom(now, 10),
			createdAt: daysFrom(now, -2)
		},
		{
			id: demoId('quote', 3),
			commissionId: trousers,
			tailorId: personId('benedek.harrow@tackline.test'),
			priceMinor: 13400,
			deliveryDate: dateFrom(now, 30),
			fittingsIncluded: 1,
			fabricIncluded: false,
			message:
				'This price is for the making. I can get olive linen from the Northmere cloth market at about 18 euros a metre; you would need about 2.4 m.',
			validUntil: daysFrom(now, 7),
			createdAt: daysFrom(now, -1)
		},
		{
			id: demoId('quote', 4),
			commissionId: shiftDress,
			tailorId: personId('sunniva.crale@tackline.test'),
			priceMinor: 24500,
			deliveryDate: dateFrom(now, 40),
			fittingsIncluded: 2,
			fabricIncluded: true,
			message:
				'A crepe in deep teal would hang well for this shape. First fitting in calico, second in the real cloth before the facings go in.',
			validUntil: daysFrom(now, 12),
			createdAt: daysFrom(now, -4)
		},
		{
			id: demoId('quote', 5),
			commissionId: shiftDress,
			tailorId: personId('caius.brennagh@tackline.test'),
			priceMinor: 21000,
			deliveryDate: dateFrom(now, 52),
			fittingsIncluded: 1,
			fabricIncluded: true,
			message: 'I would line it in cupro so it moves well. One fitting at my workroom by the Tannery Steps.',
			validUntil: daysFrom(now, 9),
			createdAt: daysFrom(now, -3)
		},
		{
			id: demoId('quote', 6),
			commissionId: felixTrousers,
			tailorId: personId('yusra.tamblin@tackline.test'),
			priceMinor: 11800,
			deliveryDate: dateFrom(now, 28),
			fittingsIncluded: 1,
			fabricIncluded: false,
			message:
				'For the making only, in the cloth you bring. Please wash it once before the fitting so it does not shrink later.',
			validUntil: daysFrom(now, 10),
			createdAt: daysFrom(now, -1)
		},
		{
			id: demoId('quote', 7),
			commissionId: aLineSkirt,
			tailorId: personId('hettie.pellow@tackline.test'),
			priceMinor: 9600,
			deliveryDate: dateFrom(now, 26),
			fittingsIncluded: 1,
			fabricIncluded: true,
			message: 'A cotton twill in rust or bottle green; one fitting for the hem length.',
			validUntil: daysFrom(now, 14),
			createdAt: daysFrom(now, -5)
		},
		{
			id: demoId('quote', 8),
			commissionId: aLineSkirt,
			tailorId: personId('petronella.vance@tackline.test'),
			priceMinor: 10400,
			deliveryDate: dateFrom(now, 45),
			fittingsIncluded: 1,
			fabricIncluded: true,
			message: 'Happy to make this, though not before mid-month.',
			validUntil: daysFrom(now, 10),
			status: 'withdrawn' as const,
			decidedAt: daysFrom(now, -2),
			createdAt: daysFrom(now, -5)
		}
	].map((q) => ({ ...q, currency }));
}

/**
 * Stores the demo quotes and the conversation each quoting tailor has with the customer, as sending a quote
 * opens it. Idempotent: fixed ids, `on conflict do nothing`, and threads found again rather than doubled.
 */
export async function seedDemoQuotes(db: Executor, now: Date) {
	const quotes = demoQuotes(now);
	await db.insert(quote).values(quotes).onConflictDoNothing();
	for (const q of quotes) await openThread(db, { commissionId: q.commissionId, tailorId: q.tailorId });
}
