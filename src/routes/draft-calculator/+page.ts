import { garmentIds, units, type GarmentId, type Unit } from '$lib/drafting';
import type { PageLoad } from './$types';

// Computed in the browser from what is typed; nothing to prerender.
export const prerender = false;

export const load: PageLoad = async ({ url, parent }) => {
	const garment = url.searchParams.get('garment');
	// An explicit ?unit= wins; otherwise a signed-in person sees their preferred unit.
	const unit = url.searchParams.get('unit') ?? (await parent()).user?.units ?? null;
	return {
		garment: (garmentIds as readonly string[]).includes(garment ?? '') ? (garment as GarmentId) : undefined,
		unit: (units as readonly string[]).includes(unit ?? '') ? (unit as Unit) : undefined
	};
};
