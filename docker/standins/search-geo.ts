/**
 * Where the search stand-in keeps documents with a `_geo` point: a grid of 0.1° cells, so a radius search
 * reads the cells its bounding box touches instead of every document. Each entry keeps its point in
 * numbers (and the cosine of its latitude) so that distances cost a few multiplications.
 */
import type { Doc } from './search-filter';

export const earthRadiusM = 6_371_008.8;
const rad = Math.PI / 180;
const cellDeg = 0.1;
const rows = Math.round(180 / cellDeg) + 1;
const columns = Math.round(360 / cellDeg);

export type GeoEntry = {
	key: string;
	doc: Doc;
	lat: number;
	lng: number;
	cosLat: number;
	cell: number;
	/** Where the entry sits in its cell's array. */
	slot: number;
};

/** The document's point, or null when it has none (such a document never matches a radius). */
export function pointOf(doc: Doc): { lat: number; lng: number } | null {
	const geo = doc._geo as { lat?: unknown; lng?: unknown } | undefined;
	if (!geo || geo.lat === undefined || geo.lng === undefined) return null;
	const lat = Number(geo.lat);
	const lng = Number(geo.lng);
	return Number.isFinite(lat) && Number.isFinite(lng) ? { lat, lng } : null;
}

const rowOf = (lat: number) => Math.min(rows - 1, Math.max(0, Math.floor((lat + 90) / cellDeg)));
const columnOf = (lng: number) => ((Math.floor((lng + 180) / cellDeg) % columns) + columns) % columns;

/**
 * Great-circle metres from a centre (its cosine given) to an entry: the same haversine, in the same order
 * of operations, as `haversineMetres` in search-filter.ts, so the prefilter and the filter agree exactly.
 */
export function metresTo(centre: { lat: number; lng: number; cosLat: number }, entry: GeoEntry) {
	const dLat = (entry.lat - centre.lat) * rad;
	const dLng = (entry.lng - centre.lng) * rad;
	const h = Math.sin(dLat / 2) ** 2 + centre.cosLat * entry.cosLat * Math.sin(dLng / 2) ** 2;
	return 2 * earthRadiusM * Math.asin(Math.min(1, Math.sqrt(h)));
}

export class GeoGrid {
	private readonly cells = new Map<number, GeoEntry[]>();
	private readonly entries = new Map<string, GeoEntry>();

	get size() {
		return this.entries.size;
	}

	set(key: string, doc: Doc) {
		this.delete(key);
		const point = pointOf(doc);
		if (!point) return;
		const cell = rowOf(point.lat) * columns + columnOf(point.lng);
		let bucket = this.cells.get(cell);
		if (!bucket) this.cells.set(cell, (bucket = []));
		const entry: GeoEntry = { key, doc, ...point, cosLat: Math.cos(point.lat * rad), cell, slot: bucket.length };
		this.entries.set(key, entry);
		bucket.push(entry);
	}

	delete(key: string) {
		const entry = this.entries.get(key);
		if (!entry) return;
		this.entries.delete(key);
		const bucket = this.cells.get(entry.cell)!;
		// Swap-remove: the last entry of the cell takes the leaving one's slot.
		const last = bucket.pop()!;
		if (last !== entry) {
			bucket[entry.slot] = last;
			last.slot = entry.slot;
		}
		if (bucket.length === 0) this.cells.delete(entry.cell);
	}

	clear() {
		this.cells.clear();
		this.entries.clear();
	}

	/**
	 * Calls `visit` with every entry within `metres` of the centre and its distance. Only the cells of the
	 * circle's bounding box are read: no point nearer than `metres` lies outside the latitude band
	 * |Δφ| ≤ d/R, nor outside |Δλ| ≤ 2·asin(sin(d/2R) / cos φmax) (haversine with cos φ ≥ cos φmax).
	 */
	within(centre: { lat: number; lng: number }, metres: number, visit: (entry: GeoEntry, metres: number) => void) {
		const origin = { ...centre, cosLat: Math.cos(centre.lat * rad) };
		const reach = (metres * 1.01) / earthRadiusM; // radians, with room for rounding
		const latLow = centre.lat - reach / rad;
		const latHigh = centre.lat + reach / rad;
		const widest = Math.max(Math.abs(latLow), Math.abs(latHigh));
		const spread = widest >= 90 ? 2 : Math.sin(reach / 2) / Math.cos(widest * rad);
		const lngReach = spread >= 1 ? 180 : (2 * Math.asin(spread)) / rad;
		const rowLow = rowOf(latLow);
		const rowHigh = rowOf(latHigh);
		let columnLow = Math.floor((centre.lng - lngReach + 180) / cellDeg);
		let columnHigh = Math.floor((centre.lng + lngReach + 180) / cellDeg);
		const allColumns = lngReach >= 180 - cellDeg || columnHigh - columnLow + 1 >= columns;
		if (allColumns) [columnLow, columnHigh] = [0, columns - 1];
		const spanColumns = columnHigh - columnLow + 1;
		const check = (entry: GeoEntry) => {
			const d = metresTo(origin, entry);
			if (d <= metres) visit(entry, d);
		};
		if ((rowHigh - rowLow + 1) * spanColumns > this.cells.size) {
			// A wide circle over few cells: read the cells there are, skipping those outside the box.
			for (const [cell, bucket] of this.cells) {
				const row = Math.floor(cell / columns);
				if (row < rowLow || row > rowHigh) continue;
				const column = cell % columns;
				const offset = (((column - columnLow) % columns) + columns) % columns;
				if (!allColumns && offset >= spanColumns) continue;
				for (const entry of bucket) check(entry);
			}
			return;
		}
		for (let row = rowLow; row <= rowHigh; row++) {
			for (let c = columnLow; c <= columnHigh; c++) {
				const bucket = this.cells.get(row * columns + (((c % columns) + columns) % columns));
				if (bucket) for (const entry of bucket) check(entry);
			}
		}
	}
}
