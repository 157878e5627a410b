import { garmentIds, units, type GarmentId, type Unit } from '$lib/drafting';
import type { PageLoad } from './$types';

// Computed in the browser from what is typed; nothing to prerender.
export const prerender = false;

export const load: PageLoad = ({ url }) => {
	const garment = url.searchParams.get('garment');
	const unit = url.searchParams.get('unit');
	return {
		garment: (garmentIds as readonly string[]).includes(garment ?? '') ? (garment as GarmentId) : undefined,
		unit: (units as readonly string[]).includes(unit ?? '') ? (unit as Unit) : undefined
	};
};
