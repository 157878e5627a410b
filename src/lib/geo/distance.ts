import type { LatLng } from './coarsen';

/** The mean radius R1 of the WGS-84 / GRS 80 ellipsoid, in kilometres. */
export const earthMeanRadiusKm = 6371.0088;

const rad = Math.PI / 180;

/** WGS-84 semi-major axis (km) and flattening. */
const equatorialRadiusKm = 6378.137;
const flattening = 1 / 298.257223563;

/** Central angle between two points on a sphere (haversine), in radians. */
function centralAngle(lat1: number, lng1: number, lat2: number, lng2: number) {
	const h = Math.sin((lat2 - lat1) / 2) ** 2 + Math.cos(lat1) * Math.cos(lat2) * Math.sin((lng2 - lng1) / 2) ** 2;
	return 2 * Math.asin(Math.min(1, Math.sqrt(h)));
}

/** Great-circle distance on a sphere of the WGS-84 mean radius: up to 0.56 % off the ellipsoid. */
export function sphericalDistanceKm(a: LatLng, b: LatLng): number {
	return earthMeanRadiusKm * centralAngle(a.lat * rad, a.lng * rad, b.lat * rad, b.lng * rad);
}

/**
 * Distance on the WGS-84 ellipsoid by Lambert's formula (1942): the great circle between the reduced
 * latitudes, corrected for the flattening — within about 0.01 % wherever a spherical radius would be off
 * by up to half a percent (north–south near the equator).
 */
export function distanceKm(a: LatLng, b: LatLng): number {
	const beta1 = Math.atan((1 - flattening) * Math.tan(a.lat * rad));
	const beta2 = Math.atan((1 - flattening) * Math.tan(b.lat * rad));
	const sigma = centralAngle(beta1, a.lng * rad, beta2, b.lng * rad);
	if (sigma === 0) return 0;
	const p = (beta1 + beta2) / 2;
	const q = (beta2 - beta1) / 2;
	const x = ((sigma - Math.sin(sigma)) * Math.sin(p) ** 2 * Math.cos(q) ** 2) / Math.cos(sigma / 2) ** 2;
	const y = ((sigma + Math.sin(sigma)) * Math.cos(p) ** 2 * Math.sin(q) ** 2) / Math.sin(sigma / 2) ** 2;
	return equatorialRadiusKm * (sigma - (flattening / 2) * (x + y));
}

/**
 * A latitude/longitude box holding every point within `radiusKm` of `centre`, for an indexed prefilter
 * before the exact distance. Near a pole, or when the box would cross the antimeridian, it widens to all
 * longitudes rather than wrap.
 */
export function boundingBox(centre: LatLng, radiusKm: number) {
	// One percent wider than the sphere says, so points the ellipsoid puts inside are never cut off.
	const angular = (radiusKm * 1.01) / earthMeanRadiusKm;
	const dLat = angular / rad;
	const minLat = Math.max(-90, centre.lat - dLat);
	const maxLat = Math.min(90, centre.lat + dLat);
	const reachesPole = minLat <= -90 || maxLat >= 90;
	const sinRatio = Math.sin(angular) / Math.cos(centre.lat * rad);
	const dLng = reachesPole || sinRatio >= 1 ? 180 : Math.asin(sinRatio) / rad;
	const minLng = centre.lng - dLng;
	const maxLng = centre.lng + dLng;
	if (dLng >= 180 || minLng < -180 || maxLng > 180) return { minLat, maxLat, minLng: -180, maxLng: 180 };
	return { minLat, maxLat, minLng, maxLng };
}
