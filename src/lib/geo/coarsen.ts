/** A point on the earth in decimal degrees (WGS-84). */
export interface LatLng {
	lat: number;
	lng: number;
}

/** About a kilometre of latitude: 1/111.32 of a degree (the WGS-84 meridian degree is 110.57–111.69 km). */
const cellDegreesLat = 1 / 111.32;

/**
 * Snaps a point to the centre of a grid cell about one kilometre on each side, so that a stored or shown
 * location never says more than which square kilometre someone is in. East–west, a degree of longitude
 * shrinks with the cosine of the latitude, so the cell widens in degrees towards the poles; rounding both
 * to two decimals instead would leave cells 0.4 km wide at 70° north.
 */
export function coarsen({ lat, lng }: LatLng): LatLng {
	const snappedLat = clamp(Math.round(lat / cellDegreesLat) * cellDegreesLat, -90, 90);
	const cosLat = Math.max(Math.cos((snappedLat * Math.PI) / 180), 0.01);
	const cellDegreesLng = cellDegreesLat / cosLat;
	const snappedLng = wrapLongitude(Math.round(lng / cellDegreesLng) * cellDegreesLng);
	return { lat: round5(snappedLat), lng: round5(snappedLng) };
}

function clamp(value: number, min: number, max: number) {
	return Math.min(max, Math.max(min, value));
}

function wrapLongitude(lng: number) {
	return ((((lng + 180) % 360) + 360) % 360) - 180;
}

function round5(value: number) {
	return Math.round(value * 1e5) / 1e5;
}
