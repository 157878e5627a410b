import { describe, expect, it } from 'vitest';
import { magicLinkRequest, passwordChange, passwordSignIn, signUp } from './schemas';

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

describe('password policy', () => {
	const signUpWith = (password: string) => signUp.safeParse({ ...valid, password });
	const reason = (result: ReturnType<typeof signUpWith>) =>
		result.error?.issues.find((issue) => issue.path[0] === 'password')?.message;

	it('refuses common and guessable passwords, saying why', () => {
		expect(reason(signUpWith('password123!'))).toMatch(/Choose a harder password\. This is similar to a commonly used/);
		expect(reason(signUpWith('qwertyuiop'))).toMatch(/Choose a harder password/);
	});

	it('refuses the email address itself and one repeated character', () => {
		expect(
			reason(signUp.safeParse({ ...valid, email: 'ada.quill@example.test', password: 'ada.quill@example.test' }))
		).toBe('Don’t use your email address as your password.');
		expect(reason(signUpWith('zzzzzzzzzzzz'))).toBe('Use more than one repeated character.');
	});

	it('accepts a few unrelated words, the demo password included', () => {
		expect(signUpWith('correct horse staple').success).toBe(true);
		expect(signUpWith('tackline-demo').success).toBe(true);
	});

	it('applies to a new password on the account page too', () => {
		const change = passwordChange({ email: 'ada@example.test', name: 'Ada Quill' });
		const weak = change.safeParse({ newPassword: 'password123!', confirmPassword: 'password123!' });
		expect(weak.error?.issues[0].path).toEqual(['newPassword']);
		expect(change.safeParse({ newPassword: 'second password', confirmPassword: 'second password' }).success).toBe(true);
	});
});
