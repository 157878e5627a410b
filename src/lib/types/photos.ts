/** A stored photo as pages and API clients see it: same-origin addresses that check who is asking. */
export type PhotoView = {
	id: string;
	url: string;
	thumbUrl: string;
	width: number;
	height: number;
	altText: string;
};

export const photoVariants = ['full', 'thumb'] as const;
export type PhotoVariant = (typeof photoVariants)[number];

export function photoUrl(id: string, variant: PhotoVariant = 'full') {
	return `/photos/${id}/${variant}`;
}

/** How many photos one commission and one workroom portfolio may hold. */
export const photoLimits = { commission: 8, portfolio: 12 } as const;

/** Longest alt text accepted, in characters. */
export const maxAltTextLength = 300;

/** One piece of work in a workroom's portfolio, with its photos in order. Public. */
export type PortfolioItemView = {
	id: string;
	caption: string;
	garmentType: string | null;
	photos: PhotoView[];
};
