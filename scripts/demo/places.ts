import type { NewLocalPlace } from '../../src/lib/server/db/schema';
import { city, districts } from './city';

/** The demo city's country, by its coordinates and time zone. */
export const demoCountry = 'FR';

export function placeIdOf(districtName: string) {
	return `merrowgate-${districtName.toLowerCase().replace(/[^a-z]+/g, '-')}`;
}

/** Merrowgate is our own invention, so it and its districts join the place list from the seed. */
export function demoPlaces(): NewLocalPlace[] {
	const centre = districts.oldQuay;
	return [
		{ id: 'merrowgate', name: city, admin: '', country: demoCountry, lat: centre.lat, lng: centre.lng },
		...Object.values(districts).map((d) => ({
			id: placeIdOf(d.name),
			name: d.name,
			admin: city,
			country: demoCountry,
			lat: d.lat,
			lng: d.lng
		}))
	];
}
