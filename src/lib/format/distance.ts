/**
 * A distance as people say it: tenths of a kilometre below 10 km ("2.4 km", "under 0.1 km"), whole
 * kilometres from there ("about 14 km"). Locations are coarsened to about a kilometre, so no finer.
 */
export function formatDistance(km: number): string {
	if (km < 0.05) return 'under 0.1 km';
	if (km < 9.95) return `${(Math.round(km * 10) / 10).toFixed(1)} km`;
	return `about ${Math.round(km)} km`;
}
