import { expect, type Page } from '@playwright/test';

export function uniqueEmail(prefix: string) {
	return `${prefix}.${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}@example.test`;
}

export async function signInWithPassword(page: Page, email: string, password: string) {
	await page.goto('/sign-in');
	const form = page.getByRole('region', { name: 'With your password' });
	await form.getByLabel('Email address').fill(email);
	await form.getByLabel('Password').fill(password);
	await form.getByRole('button', { name: 'Sign in' }).click();
	// Checking the password hash takes a moment on a busy machine.
	await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000 });
}

/** Signs a new account up through the form and waits for its home page. */
export async function signUp(page: Page, role: 'customer' | 'tailor', email: string, password: string) {
	await page.goto(`/sign-up?role=${role}`);
	await page.getByLabel('Your name').fill(role === 'tailor' ? 'Oriel Stannard' : 'Bettany Quine');
	await page.getByLabel('Email address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: /create account/i }).click();
	// Hashing the new password takes a moment on a busy machine.
	await expect(page).toHaveURL(role === 'tailor' ? /\/workroom/ : /\/commissions/, { timeout: 20_000 });
}
