/** About one kilometre north–south, in degrees of latitude. */
const cellDegrees = 0.009;

/**
 * Snaps a point to the centre of a grid cell about 1 km on each side: rows by latitude, and within a row
 * columns as wide in degrees as 1 km is at that latitude, so the precision holds east–west too.
 */
export function coarsen({ lat, lng }: { lat: number; lng: number }) {
	const row = Math.floor(lat / cellDegrees);
	const rowLat = (row + 0.5) * cellDegrees;
	const lngCell = cellDegrees / Math.max(Math.cos((rowLat * Math.PI) / 180), 0.01);
	const column = Math.floor(lng / lngCell);
	const round = (v: number) => Math.round(v * 1e5) / 1e5;
	return { lat: round(Math.min(Math.max(rowLat, -90), 90)), lng: round((column + 0.5) * lngCell) };
}
