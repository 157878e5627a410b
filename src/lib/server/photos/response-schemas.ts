import { z } from 'zod';

/* The JSON answers of the photo endpoints (`PhotoView`, `PortfolioItemView` in $lib/types/photos). */

export const photoResponse = z
	.object({
		id: z.uuid(),
		url: z.string().meta({ description: 'Same-origin address of the full image; checks who is asking.' }),
		thumbUrl: z.string(),
		width: z.int(),
		height: z.int(),
		altText: z.string()
	})
	.meta({ id: 'Photo' });

export const photoListResponse = z.object({ items: z.array(photoResponse) });

export const portfolioItemResponse = z
	.object({ id: z.uuid(), caption: z.string(), garmentType: z.string().nullable(), photos: z.array(photoResponse) })
	.meta({ id: 'PortfolioItem' });

export const portfolioItemListResponse = z.object({ items: z.array(portfolioItemResponse) });

export const portfolioResponse = z.object({
	items: z.array(portfolioItemResponse),
	photoCount: z.int().meta({ description: 'Photos across every item.' })
});
