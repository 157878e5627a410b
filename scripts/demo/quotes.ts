import type { NewQuote } from '../../src/lib/server/db/schema';
import { currency } from './city';
import { demoId } from './ids';
import { personId } from './people';
import { dateFrom, daysFrom } from './time';

// Three offers on the demo customer's trousers, so the side-by-side comparison has something to show.
// The demo tailor has not quoted yet: that is theirs to try.
const trousers = demoId('commission', 1);

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
		}
	].map((q) => ({ ...q, currency }));
}
