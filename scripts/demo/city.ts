/** Merrowgate, the invented river-mouth city the demo takes place in. */
export const city = 'Merrowgate';
export const currency = 'EUR';
export const timeZone = 'Europe/Paris';

export const districts = {
	oldQuay: { name: 'Old Quay', lat: 46.8512, lng: 3.2089 },
	loomside: { name: 'Loomside', lat: 46.8587, lng: 3.2201 },
	saltmarket: { name: 'Saltmarket', lat: 46.8466, lng: 3.2034 },
	brightwater: { name: 'Brightwater', lat: 46.8631, lng: 3.1958 },
	ferrinHill: { name: 'Ferrin Hill', lat: 46.8398, lng: 3.2243 },
	theSallows: { name: 'The Sallows', lat: 46.8702, lng: 3.2312 },
	cobbleRow: { name: 'Cobble Row', lat: 46.8549, lng: 3.1987 },
	northmere: { name: 'Northmere', lat: 46.8795, lng: 3.2105 },
	kilnfield: { name: 'Kilnfield', lat: 46.8337, lng: 3.1899 },
	wrenwick: { name: 'Wrenwick', lat: 46.845, lng: 3.242 }
} as const;

export type DistrictKey = keyof typeof districts;

export { coarsen } from '../../src/lib/geo/coarsen';
