import type { GarmentId } from './measurements';

/**
 * Each garment's display name, without its drafting template: pages that only name a garment (commission
 * lists, quotes, orders) load this instead of every template's drafting code. Kept equal to the templates'
 * `name` by `garment-names.spec.ts`.
 */
export const garmentNames: Readonly<Record<GarmentId, string>> = {
	'wide-leg-trousers': 'Wide-leg high-waisted trousers',
	'cropped-top': 'Cropped top with cut-in-one sleeves',
	'straight-skirt': 'Straight skirt',
	'a-line-skirt': 'A-line skirt',
	'shift-dress': 'Shift dress',
	tunic: 'Loose tunic / kaftan',
	shirt: 'Shirt / blouse with set-in sleeves',
	waistcoat: 'Lined waistcoat'
};

export function isGarmentId(id: string): id is GarmentId {
	return Object.hasOwn(garmentNames, id);
}
