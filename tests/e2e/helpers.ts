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
	await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'), { timeout: 30_000, waitUntil: 'commit' });
}

/** The path of the newest confirmation link mailed to `email`, read from the mail stand-in's API. */
export async function confirmationLink(email: string) {
	const deadline = Date.now() + 15_000;
	while (Date.now() < deadline) {
		const response = await fetch(`${process.env.MAIL_INBOX_URL}/messages?to=${encodeURIComponent(email)}`);
		const mails = (await response.json()) as { subject: string; text: string }[];
		const mail = mails.find((m) => m.subject === 'Your Tackline confirmation link');
		if (mail) {
			const link = new URL(/https?:\/\/\S+/.exec(mail.text)![0]);
			return link.pathname + link.search;
		}
		await new Promise((r) => setTimeout(r, 100));
	}
	throw new Error(`no confirmation mail for ${email}`);
}

/** Signs a new account up through the form, opens the mailed confirmation link and waits for its home page. */
export async function signUp(page: Page, role: 'customer' | 'tailor', email: string, password: string) {
	await page.goto(`/sign-up?role=${role}`);
	await page.getByLabel('Your name').fill(role === 'tailor' ? 'Oriel Stannard' : 'Bettany Quine');
	await page.getByLabel('Email address').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: /create account/i }).click();
	// Hashing the new password takes a moment on a busy machine.
	await expect(page.getByText('Check your inbox')).toBeVisible({ timeout: 20_000 });
	await page.goto(await confirmationLink(email));
	await expect(page).toHaveURL(role === 'tailor' ? /\/workroom/ : /\/commissions/, { timeout: 20_000 });
}
