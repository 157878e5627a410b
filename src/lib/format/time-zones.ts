/** The zone a new account starts in when the browser does not say (no JavaScript). */
export const fallbackTimeZone = 'UTC';

const supported = new Set(Intl.supportedValuesOf('timeZone').concat(fallbackTimeZone));

/**
 * The zone's name as this engine lists it ("Asia/Kolkata" → "Asia/Calcutta" where ICU keeps the
 * older name), or null when it is not a real IANA zone.
 */
export function canonicalTimeZone(zone: string): string | null {
	if (!/^[A-Za-z][A-Za-z0-9_+\-/]{0,63}$/.test(zone)) return null;
	try {
		const resolved = new Intl.DateTimeFormat('en', { timeZone: zone }).resolvedOptions().timeZone;
		return supported.has(resolved) ? resolved : null;
	} catch {
		return null;
	}
}

/** The browser's own zone when it is one we list; meant for the browser, but safe anywhere. */
export function deviceTimeZone(): string | null {
	return canonicalTimeZone(Intl.DateTimeFormat().resolvedOptions().timeZone ?? '');
}

export type TimeZoneOption = { value: string; label: string };
export type TimeZoneGroup = { region: string; zones: TimeZoneOption[] };

const regionNames: Record<string, string> = {
	America: 'Americas',
	Atlantic: 'Atlantic Ocean',
	Indian: 'Indian Ocean',
	Pacific: 'Pacific Ocean'
};

// Places ICU still lists under an older spelling.
const placeNames: Record<string, string> = {
	'Asia/Calcutta': 'Kolkata',
	'Asia/Katmandu': 'Kathmandu',
	'Asia/Rangoon': 'Yangon',
	'Asia/Saigon': 'Ho Chi Minh City',
	'Europe/Kiev': 'Kyiv',
	'Atlantic/Faeroe': 'Faroe Islands'
};

/** "UTC+01:00" for the zone's offset at `at` (summer time included). */
export function utcOffset(zone: string, at: Date): string {
	const part = new Intl.DateTimeFormat('en', { timeZone: zone, timeZoneName: 'longOffset' })
		.formatToParts(at)
		.find((p) => p.type === 'timeZoneName')?.value;
	const offset = part?.replace(/^GMT/, '') || '+00:00';
	return `UTC${offset}`;
}

/** "London", "New York", "Buenos Aires, Argentina". */
export function placeName(zone: string): string {
	if (placeNames[zone]) return placeNames[zone];
	const [, ...rest] = zone.split('/');
	return rest.reverse().join(', ').replaceAll('_', ' ') || zone;
}

/** Every listed zone, grouped by region and sorted by place, each labelled with its offset at `at`. */
export function timeZoneGroups(at: Date): TimeZoneGroup[] {
	const byRegion = new Map<string, TimeZoneOption[]>();
	for (const zone of supported) {
		if (zone === fallbackTimeZone) continue;
		const region = zone.split('/')[0];
		const zones = byRegion.get(region) ?? [];
		zones.push({ value: zone, label: `${placeName(zone)} (${utcOffset(zone, at)})` });
		byRegion.set(region, zones);
	}
	const groups = [...byRegion]
		.sort(([a], [b]) => a.localeCompare(b))
		.map(([region, zones]) => ({
			region: regionNames[region] ?? region,
			zones: zones.sort((a, b) => a.label.localeCompare(b.label))
		}));
	return [
		...groups,
		{ region: 'Other', zones: [{ value: fallbackTimeZone, label: 'Coordinated Universal Time (UTC)' }] }
	];
}
