import { describe, expect, it } from 'vitest';
import { magicLinkRequest, passwordSignIn, signUp } from './schemas';

const valid = { name: ' Ada Quill ', email: ' Ada@Example.TEST ', password: 'ten chars!', role: 'customer' };

describe('signUp', () => {
	it('trims the name and normalises the email', () => {
		expect(signUp.parse(valid)).toEqual({
			name: 'Ada Quill',
			email: 'ada@example.test',
			password: 'ten chars!',
			role: 'customer',
			timeZone: 'UTC'
		});
	});

	it('asks for at least ten characters of password', () => {
		const result = signUp.safeParse({ ...valid, password: 'nine char' });
		expect(result.success).toBe(false);
		expect(result.error?.issues[0].message).toBe('Use at least 10 characters.');
	});

	it('offers only the customer and tailor roles', () => {
		expect(signUp.safeParse({ ...valid, role: 'tailor' }).success).toBe(true);
		const admin = signUp.safeParse({ ...valid, role: 'admin' });
		expect(admin.success).toBe(false);
		expect(admin.error?.issues[0].path).toEqual(['role']);
	});

	it('explains a malformed email and a missing name', () => {
		const result = signUp.safeParse({ ...valid, name: '  ', email: 'not-an-address' });
		const messages = Object.fromEntries(result.error!.issues.map((i) => [i.path[0], i.message]));
		expect(messages).toEqual({
			name: 'Tell us your name.',
			email: 'Enter a valid email address, like name@example.com.'
		});
	});
});

describe('sign-in schemas', () => {
	it('need an email and a password', () => {
		expect(passwordSignIn.safeParse({ email: 'a@b.test', password: '' }).success).toBe(false);
		expect(passwordSignIn.parse({ email: 'A@B.test', password: 'x' }).email).toBe('a@b.test');
		expect(magicLinkRequest.safeParse({ email: '' }).error?.issues[0].message).toBe('Enter your email address.');
	});
});
