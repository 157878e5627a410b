import { desc, eq } from 'drizzle-orm';
import { distanceKm } from '$lib/geo/distance';
import type { ComparedQuote, PortfolioThumb, QuoteComparison } from '$lib/types/quote-comparison';
import * as commissions from '../commissions';
import type { Executor } from '../db';
import { quote, type Quote } from '../db/schema';
import { portfolio } from '../photos';
import { threadIdFor } from '../messages';
import * as workrooms from '../workrooms';
import { bestFitHint, byFit, daysBetween, fitMethod, scoreQuotes, type FitInput } from './fit';

/** Portfolio photos shown beside each quote. */
const thumbsPerQuote = 3;
/** The response time is the median over this many of the workroom's latest quotes... */
const responseWindow = 50;
/** ...once it has sent at least this many; before that it is "new". */
const responseMinimum = 3;

function median(values: number[]): number {
	const sorted = [...values].sort((a, b) => a - b);
	const mid = Math.floor(sorted.length / 2);
	return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** Median hours from publication to the workroom's quote, over its latest quotes; null while it has few. */
async function responseTimes(db: Executor, tailorIds: string[]) {
	const result = new Map<string, { hours: number | null; sample: number }>();
	for (const tailorId of tailorIds) {
		const sent = await db
			.select({ commissionId: quote.commissionId, createdAt: quote.createdAt })
			.from(quote)
			.where(eq(quote.tailorId, tailorId))
			.orderBy(desc(quote.createdAt))
			.limit(responseWindow);
		const published = await commissions.publishedTimes(db, [...new Set(sent.map((s) => s.commissionId))]);
		const hours = sent
			.map((s) => {
				const at = published.get(s.commissionId);
				return at ? (s.createdAt.getTime() - at.getTime()) / 3_600_000 : null;
			})
			.filter((h): h is number => h !== null && h >= 0);
		result.set(tailorId, {
			hours: hours.length >= responseMinimum ? Math.round(median(hours) * 10) / 10 : null,
			sample: hours.length
		});
	}
	return result;
}

async function thumbsOf(db: Executor, tailorId: string): Promise<PortfolioThumb[]> {
	const items = await portfolio.listItems(db, { tailorId });
	return items
		.flatMap((item) => item.photos.map((photo) => ({ ...photo, altText: photo.altText || item.caption })))
		.slice(0, thumbsPerQuote)
		.map(({ id, url, thumbUrl, altText, width, height }) => ({ id, url, thumbUrl, altText, width, height }));
}

/**
 * The owner's comparison of every quote on their commission: price, delivery against the date needed,
 * fittings, fabric, distance, the workroom's lead time for the garment and its response time, portfolio
 * thumbnails, and for live quotes a best-fit score with its working (see `fitMethod`). Null for anyone
 * but the owner.
 */
export async function compare(
	db: Executor,
	{ commissionId, ownerId }: { commissionId: string; ownerId: string }
): Promise<QuoteComparison | null> {
	const row = await commissions.getForOwner(db, { id: commissionId, ownerId });
	if (!row) return null;
	const quotes: Quote[] = await db
		.select()
		.from(quote)
		.where(eq(quote.commissionId, commissionId))
		.orderBy(quote.createdAt, quote.id);
	const tailorIds = [...new Set(quotes.map((q) => q.tailorId))];
	const [rooms, responses, thumbs, threads] = await Promise.all([
		Promise.all(tailorIds.map((tailorId) => workrooms.getOwn(db, { tailorId }))),
		responseTimes(db, tailorIds),
		Promise.all(tailorIds.map((tailorId) => thumbsOf(db, tailorId))),
		Promise.all(tailorIds.map((tailorId) => threadIdFor(db, { commissionId, tailorId })))
	]);
	const roomOf = new Map(tailorIds.map((id, i) => [id, rooms[i]]));
	const thumbsFor = new Map(tailorIds.map((id, i) => [id, thumbs[i]]));
	const threadOf = new Map(tailorIds.map((id, i) => [id, threads[i]]));
	const here = row.approxLat !== null && row.approxLng !== null ? { lat: row.approxLat, lng: row.approxLng } : null;
	const budget =
		row.budgetMinMinor !== null && row.budgetMaxMinor !== null
			? { minMinor: row.budgetMinMinor, maxMinor: row.budgetMaxMinor, currency: row.currency }
			: null;

	const compared = quotes.map((q): Omit<ComparedQuote, 'fit'> => {
		const room = roomOf.get(q.tailorId) ?? null;
		const km = here && room ? Math.round(distanceKm(here, room.location) * 10) / 10 : null;
		const response = responses.get(q.tailorId) ?? { hours: null, sample: 0 };
		return {
			id: q.id,
			status: q.status,
			tailor: {
				id: q.tailorId,
				name: room?.name ?? 'A workroom',
				slug: room?.slug ?? null,
				town: room?.location.town ?? null
			},
			priceMinor: q.priceMinor,
			currency: q.currency,
			deliveryDate: q.deliveryDate,
			daysBeforeNeeded: row.dateNeeded ? daysBetween(q.deliveryDate, row.dateNeeded) : null,
			fittings: q.fittingsIncluded,
			fabricIncluded: q.fabricIncluded,
			advanceMinor: q.advanceMinor,
			message: q.message,
			validUntil: q.validUntil.toISOString(),
			createdAt: q.createdAt.toISOString(),
			declineReason: q.status === 'declined' ? q.declineReason : null,
			distanceKm: km,
			leadTimeDays: room?.leadTimes[row.garmentType as keyof typeof room.leadTimes] ?? null,
			responseHours: response.hours,
			responseSample: response.sample,
			portfolio: thumbsFor.get(q.tailorId) ?? [],
			threadId: threadOf.get(q.tailorId) ?? null
		};
	});

	const live: FitInput[] = compared
		.filter((q) => q.status === 'sent')
		.map((q) => ({
			id: q.id,
			tailorName: q.tailor.name,
			priceMinor: q.priceMinor,
			currency: q.currency,
			deliveryDate: q.deliveryDate,
			distanceKm: q.distanceKm
		}));
	const context = { dateNeeded: row.dateNeeded, budget };
	const fits = scoreQuotes(live, context);
	const order = new Map([...live].sort(byFit(fits)).map((q, i) => [q.id, i]));
	return {
		commissionId,
		dateNeeded: row.dateNeeded,
		budget,
		quotes: compared
			.map((q) => ({ ...q, fit: fits.get(q.id) ?? null }))
			// Live quotes best first, then the decided ones newest first.
			.sort(
				(a, b) =>
					(order.get(a.id) ?? Infinity) - (order.get(b.id) ?? Infinity) || b.createdAt.localeCompare(a.createdAt)
			),
		hint: bestFitHint(live, fits),
		method: fitMethod
	};
}
