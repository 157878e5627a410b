import { describe, expect, it } from 'vitest';
import { profileUpdate, signUp } from './schemas';

const profile = { name: 'Ada Quill', units: 'cm' };
const newAccount = { name: 'Ada Quill', email: 'ada@example.test', password: 'ten chars!', role: 'customer' };

describe('time zone on the profile', () => {
	it('accepts real IANA zones, including UTC', () => {
		expect(profileUpdate.parse({ ...profile, timeZone: 'Europe/Lisbon' }).timeZone).toBe('Europe/Lisbon');
		expect(profileUpdate.parse({ ...profile, timeZone: 'UTC' }).timeZone).toBe('UTC');
	});

	it('stores a renamed zone under the name the list uses', () => {
		const listed = Intl.supportedValuesOf('timeZone');
		const stored = profileUpdate.parse({ ...profile, timeZone: 'Asia/Kolkata' }).timeZone;
		expect(listed).toContain(stored);
	});

	it('refuses anything else with a message for the field', () => {
		for (const timeZone of ['Mars/Olympus', '', 'Europe/../etc', 'GMT+5', '+01:00']) {
			const result = profileUpdate.safeParse({ ...profile, timeZone });
			expect(result.success).toBe(false);
			expect(result.error?.issues[0]).toMatchObject({
				path: ['timeZone'],
				message: 'Choose a time zone from the list.'
			});
		}
	});
});

describe('time zone at sign-up', () => {
	it('keeps the zone the browser sent', () => {
		expect(signUp.parse({ ...newAccount, timeZone: 'America/Sao_Paulo' }).timeZone).toBe('America/Sao_Paulo');
	});

	it('starts in UTC when the browser sent none or nonsense', () => {
		expect(signUp.parse(newAccount).timeZone).toBe('UTC');
		expect(signUp.parse({ ...newAccount, timeZone: 'Nowhere/Special' }).timeZone).toBe('UTC');
	});
});
