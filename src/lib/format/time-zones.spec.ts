import { describe, expect, it } from 'vitest';
import { canonicalTimeZone, placeName, timeZoneGroups, utcOffset } from './time-zones';

describe('placeName', () => {
	it('reads the place after the region, with spaces', () => {
		expect(placeName('Europe/London')).toBe('London');
		expect(placeName('America/New_York')).toBe('New York');
		expect(placeName('America/Sao_Paulo')).toBe('Sao Paulo');
		expect(placeName('America/Argentina/Buenos_Aires')).toBe('Buenos Aires, Argentina');
	});

	it('uses the current spelling where the zone id keeps an older one', () => {
		expect(placeName('Europe/Kiev')).toBe('Kyiv');
	});
});

describe('utcOffset', () => {
	// IANA tz database: London is UTC+0 in winter and UTC+1 (BST) in summer; Sao Paulo UTC-3 all year since 2019.
	it('shows the offset in force at the given moment', () => {
		expect(utcOffset('Europe/London', new Date('2027-01-15T12:00:00Z'))).toBe('UTC+00:00');
		expect(utcOffset('Europe/London', new Date('2027-07-15T12:00:00Z'))).toBe('UTC+01:00');
		expect(utcOffset('America/Sao_Paulo', new Date('2027-01-15T12:00:00Z'))).toBe('UTC-03:00');
		expect(utcOffset('Asia/Kathmandu', new Date('2027-01-15T12:00:00Z'))).toBe('UTC+05:45');
	});
});

describe('canonicalTimeZone', () => {
	it('knows real zones and nothing else', () => {
		expect(canonicalTimeZone('Europe/Lisbon')).toBe('Europe/Lisbon');
		expect(canonicalTimeZone('UTC')).toBe('UTC');
		expect(canonicalTimeZone('Mars/Olympus')).toBeNull();
		expect(canonicalTimeZone('Europe/London\u0000')).toBeNull();
	});
});

describe('timeZoneGroups', () => {
	const groups = timeZoneGroups(new Date('2027-07-15T12:00:00Z'));

	it('groups every listed zone by region, once each', () => {
		const values = groups.flatMap((g) => g.zones.map((z) => z.value));
		expect(new Set(values).size).toBe(values.length);
		expect(values.length).toBe(Intl.supportedValuesOf('timeZone').length + 1);
		expect(groups.map((g) => g.region)).toEqual(
			expect.arrayContaining(['Africa', 'Americas', 'Asia', 'Europe', 'Other'])
		);
	});

	it('labels each zone with its place and offset', () => {
		const europe = groups.find((g) => g.region === 'Europe')!;
		expect(europe.zones).toContainEqual({ value: 'Europe/London', label: 'London (UTC+01:00)' });
		const americas = groups.find((g) => g.region === 'Americas')!;
		expect(americas.zones).toContainEqual({ value: 'America/New_York', label: 'New York (UTC-04:00)' });
	});
});
