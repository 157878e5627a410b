/**
 * Quotes made directly in a test's own database, as sending one stores them: a live `sent` quote by
 * default, or any other status with its decision time stamped.
 */
import { and, eq, ne } from 'drizzle-orm';
import type { Executor } from '../../src/lib/server/db/client';
import {
	commission,
	order,
	quote,
	tailorProfile,
	type NewQuote,
	type QuoteStatus
} from '../../src/lib/server/db/schema';
import { createPortfolioPhoto, createWorkroom, type PersonOptions, type Workroom } from './index';

const day = 24 * 60 * 60 * 1000;

function isoDate(at: Date) {
	return at.toISOString().slice(0, 10);
}

export type QuoteOptions = { commissionId: string; tailorId: string; status?: QuoteStatus } & Partial<
	Omit<NewQuote, 'commissionId' | 'tailorId' | 'status'>
>;

export type CreatedQuote = {
	id: string;
	commissionId: string;
	tailorId: string;
	status: QuoteStatus;
	priceMinor: number;
	currency: string;
	deliveryDate: string;
	validUntil: Date;
};

/**
 * A quote from `tailorId` on `commissionId`: 7 500 EUR minor units, delivery in 30 days, valid for 14 days,
 * one fitting, fabric included, unless told otherwise. Non-`sent` statuses get `decidedAt` now.
 */
export async function createQuote(db: Executor, options: QuoteOptions): Promise<CreatedQuote> {
	const { commissionId, tailorId, status = 'sent', ...fields } = options;
	const now = Date.now();
	const [row] = await db
		.insert(quote)
		.values({
			priceMinor: 7500,
			currency: 'EUR',
			deliveryDate: isoDate(new Date(now + 30 * day)),
			fittingsIncluded: 1,
			fabricIncluded: true,
			message: 'Happy to make this in a mid-weight wool; one fitting at the workroom.',
			validUntil: new Date(now + 14 * day),
			decidedAt: status === 'sent' ? null : new Date(now),
			...fields,
			commissionId,
			tailorId,
			status
		})
		.returning();
	return {
		id: row.id,
		commissionId: row.commissionId,
		tailorId: row.tailorId,
		status: row.status,
		priceMinor: row.priceMinor,
		currency: row.currency,
		deliveryDate: row.deliveryDate,
		validUntil: row.validUntil
	};
}

/**
 * Fills in every onboarding step `createWorkroom` leaves out (bio, lead times and labour hours for its
 * garments, one portfolio photo), so the workroom may quote. Running it twice adds a second photo only.
 */
export async function completeOnboarding(db: Executor, tailorId: string) {
	await db
		.update(tailorProfile)
		.set({
			bio: 'Made-to-measure skirts and trousers from a small Merrowgate workroom.',
			specialties: ['straight-skirt', 'wide-leg-trousers'],
			leadTimes: { 'straight-skirt': 14, 'wide-leg-trousers': 21 },
			labourHours: { 'straight-skirt': 6, 'wide-leg-trousers': 9.5 },
			hourlyRateMinor: 2800,
			rateCurrency: 'EUR',
			fabricMarkupPercent: 15,
			capacity: 2,
			onboardedAt: new Date()
		})
		.where(eq(tailorProfile.userId, tailorId));
	await createPortfolioPhoto(db, { tailorId, altText: 'A finished straight skirt on a stand' });
}

/** A tailor whose onboarding is complete in every step, ready to send quotes. */
export async function createQuotingWorkroom(db: Executor, options: PersonOptions = {}): Promise<Workroom> {
	const workroom = await createWorkroom(db, options);
	await completeOnboarding(db, workroom.id);
	return workroom;
}

/** A live quote (unless `status` says otherwise) of €450, delivered in 40 days with two fittings. */
export function insertQuote(db: Executor, options: QuoteOptions): Promise<CreatedQuote> {
	return createQuote(db, {
		priceMinor: 45_000,
		deliveryDate: isoDate(new Date(Date.now() + 40 * day)),
		fittingsIncluded: 2,
		message: 'Happy to make this; two fittings included.',
		...options
	});
}

/**
 * The state an acceptance leaves behind, written directly: the quote accepted, the others declined, an order
 * awaiting payment (10 % fee) and the commission awarded. For tests about what comes after acceptance.
 */
export async function awardQuote(
	db: Executor,
	{ commissionId, quoteId, customerId }: { commissionId: string; quoteId: string; customerId: string }
) {
	const now = new Date();
	await db
		.update(quote)
		.set({ status: 'declined', declineReason: 'another quote was accepted', decidedAt: now })
		.where(and(eq(quote.commissionId, commissionId), eq(quote.status, 'sent'), ne(quote.id, quoteId)));
	const [accepted] = await db
		.update(quote)
		.set({ status: 'accepted', decidedAt: now })
		.where(eq(quote.id, quoteId))
		.returning();
	const fee = Math.floor((accepted.priceMinor * 1000 + 5000) / 10_000);
	const [row] = await db
		.insert(order)
		.values({
			commissionId,
			quoteId,
			customerId,
			tailorId: accepted.tailorId,
			priceMinor: accepted.priceMinor,
			platformFeeMinor: fee,
			tailorPayoutMinor: accepted.priceMinor - fee,
			platformFeeBasisPoints: 1000,
			currency: accepted.currency,
			dueDate: accepted.deliveryDate
		})
		.returning({ id: order.id });
	await db.update(commission).set({ status: 'awarded' }).where(eq(commission.id, commissionId));
	return { orderId: row.id };
}
