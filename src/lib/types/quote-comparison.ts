/** The customer's side-by-side view of the quotes on one commission (built by `quotes.compare`). */

export type FitCriterionId = 'on_time' | 'budget' | 'price' | 'distance';

/** One line of the best-fit working: what was checked, what this quote scored and out of how many. */
export type FitCriterion = { id: FitCriterionId; label: string; points: number; max: number; detail: string };

export type QuoteFit = { points: number; max: number; criteria: FitCriterion[] };

export type PortfolioThumb = {
	id: string;
	thumbUrl: string;
	url: string;
	altText: string;
	width: number;
	height: number;
};

export type ComparedQuote = {
	id: string;
	status: 'sent' | 'accepted' | 'declined' | 'withdrawn' | 'lapsed';
	tailor: { id: string; name: string; slug: string | null; town: string | null };
	priceMinor: number;
	currency: string;
	deliveryDate: string;
	/** Days between delivery and the date needed: positive when early, negative when late; null without a date. */
	daysBeforeNeeded: number | null;
	fittings: number;
	fabricIncluded: boolean;
	/** Paid to the tailor when the customer approves the fabric, out of the price (0 for none). */
	advanceMinor: number;
	message: string;
	validUntil: string;
	createdAt: string;
	declineReason: string | null;
	/** Workroom to the commission's area, great-circle, to 0.1 km; null when either place is unknown. */
	distanceKm: number | null;
	/** The workroom's usual lead time for this garment, in days; null when it has not said. */
	leadTimeDays: number | null;
	/** Median hours from a commission's publication to this workroom's quote on it; null while new. */
	responseHours: number | null;
	/** How many earlier quotes the response time is the median of. */
	responseSample: number;
	portfolio: PortfolioThumb[];
	/** The conversation with this workroom about the commission, when there is one. */
	threadId: string | null;
	/** Only for live (sent) quotes. */
	fit: QuoteFit | null;
};

export type BestFitHint = { quoteId: string; tailorName: string; text: string; tiedWith: string[] };

export type QuoteComparison = {
	commissionId: string;
	dateNeeded: string | null;
	budget: { minMinor: number; maxMinor: number; currency: string } | null;
	quotes: ComparedQuote[];
	hint: BestFitHint | null;
	/** How the best-fit score is worked out, one plain sentence per criterion. */
	method: string[];
};

export const comparisonSorts = ['fit', 'price', 'delivery', 'distance'] as const;
export type ComparisonSort = (typeof comparisonSorts)[number];

/** What accepting a quote would cost and pay out, shown before the customer confirms. */
export type AcceptPreview = {
	quoteId: string;
	priceMinor: number;
	platformFeeMinor: number;
	tailorPayoutMinor: number;
	/** Paid to the tailor when the customer approves the fabric, out of the payout (0 for none). */
	advanceMinor: number;
	currency: string;
	rateText: string;
};
