import type { Unit } from '$lib/drafting';
import { formatSizeBand } from '$lib/format/size-band';
import type { NearbyCommissionItem, NearbyWorkroomItem } from '$lib/types/search';
import type { NearbyCommission, NearbyWorkroom } from './nearby';

/** A near-me commission as the API sends it and the page renders it; photos through the authorising route. */
export function commissionItem(item: NearbyCommission, unit: Unit): NearbyCommissionItem {
	const { photo, publishedAt, sizeBand, ...rest } = item;
	return {
		...rest,
		sizeBand,
		sizeBandText: sizeBand.length ? formatSizeBand(sizeBand, unit) : null,
		publishedAt: publishedAt ? publishedAt.toISOString() : null,
		photo: photo && { thumbUrl: `/photos/${photo.id}/thumb`, altText: photo.altText }
	};
}

export function workroomItem(item: NearbyWorkroom): NearbyWorkroomItem {
	const { coverPhotoId, ...rest } = item;
	return { ...rest, coverThumbUrl: coverPhotoId ? `/photos/${coverPhotoId}/thumb` : null };
}
