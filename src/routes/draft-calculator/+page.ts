import { garmentIds, units, type GarmentId, type Unit } from '$lib/drafting';
import type { PageLoad } from './$types';

const isGarment = (value: string | null): value is GarmentId =>
	(garmentIds as readonly (string | null)[]).includes(value);
const isUnit = (value: string | null): value is Unit => (units as readonly (string | null)[]).includes(value);

// Computed in the browser from what is typed; nothing to prerender.
export const prerender = false;

export const load: PageLoad = async ({ url, parent }) => {
	const garment = url.searchParams.get('garment');
	// An explicit ?unit= wins; otherwise a signed-in person sees their preferred unit.
	const unit = url.searchParams.get('unit') ?? (await parent()).user?.units ?? null;
	return {
		garment: isGarment(garment) ? garment : undefined,
		unit: isUnit(unit) ? unit : undefined
	};
};
