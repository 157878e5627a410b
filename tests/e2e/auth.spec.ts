import { expect, test, type Page } from '@playwright/test';
import { confirmationLink } from './helpers';

async function linkMailsToCustomer() {
	const response = await fetch(`${process.env.MAIL_INBOX_URL}/messages?to=customer%40tackline.test`);
	const mails: { subject: string }[] = await response.json();
	return mails.filter((m) => m.subject === 'Your Tackline sign-in link').length;
}

// Sign-up, confirmation and sign-in each hash a password: give these flows room on a loaded machine.
test.describe.configure({ timeout: 120_000 });

function uniqueEmail(prefix: string) {
	return `${prefix}.${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}@example.test`;
}

async function signInWithPassword(page: Page, email: string, password: string) {
	await page.goto('/sign-in');
	const form = page.getByRole('region', { name: 'With your password' });
	await form.getByLabel('Email address').fill(email);
	await form.getByLabel('Password').fill(password);
	await form.getByRole('button', { name: 'Sign in' }).click();
	// argon2 is slow on purpose, and slower still on a busy machine.
	await page.waitForURL((url) => url.pathname !== '/sign-in', { timeout: 30_000 });
}

async function signOut(page: Page) {
	await page.locator('summary', { hasText: 'account menu' }).click();
	await page.getByRole('button', { name: 'Sign out' }).click();
	await expect(page.getByRole('link', { name: 'Sign in' }).first()).toBeVisible();
}

test('a customer signs up, signs out and signs back in', async ({ page }) => {
	const email = uniqueEmail('mira');
	await page.goto('/sign-up?role=customer');
	await page.getByLabel('Your name').fill('Mira Vantongeren');
	await page.getByLabel('Email address').fill('customer@tackline.test');
	await page.getByLabel('Password').fill('a long enough password');
	await page.getByRole('button', { name: /create account/i }).click();
	// A taken address gets the same answer as a free one; its owner hears about it by mail.
	await expect(page.getByText('Check your inbox')).toBeVisible();

	await page.goto('/sign-up?role=customer');
	await page.getByLabel('Your name').fill('Mira Vantongeren');
	await page.getByLabel('Email address').fill(email);
	await page.getByLabel('Password').fill('password123!');
	await page.getByRole('button', { name: /create account/i }).click();
	await expect(page.getByText(/Choose a harder password/)).toBeVisible();
	await expect(page.getByLabel('Your name')).toHaveValue('Mira Vantongeren');
	await page.getByLabel('Password').fill('a long enough password');
	await page.getByRole('button', { name: /create account/i }).click();
	await expect(page.getByText('Check your inbox')).toBeVisible();

	await page.goto(await confirmationLink(email));
	await expect(page).toHaveURL(/\/commissions/);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('My commissions');
	await expect(page.getByRole('main')).toContainText('Mira');

	await signOut(page);
	await signInWithPassword(page, email, 'a long enough password');
	await expect(page).toHaveURL(/\/commissions$/);
});

test('an emailed sign-in link, read by the admin in the dev inbox, signs the customer in', async ({ page }) => {
	const before = await linkMailsToCustomer();
	await page.goto('/sign-in');
	const linkForm = page.getByRole('region', { name: 'With a link, no password' });
	await linkForm.getByLabel('Email address').fill('customer@tackline.test');
	await linkForm.getByRole('button', { name: /email me/i }).click();
	await expect(page.getByText('Check your inbox')).toBeVisible();

	// The job queue mails the link a moment later.
	await expect.poll(linkMailsToCustomer, { timeout: 20_000 }).toBeGreaterThan(before);

	expect((await page.goto('/dev/inbox'))?.url()).toMatch(/\/sign-in\?redirectTo=%2Fdev%2Finbox$/);
	await signInWithPassword(page, 'admin@tackline.test', 'tackline-demo');
	await page.goto('/dev/inbox');
	await page
		.getByRole('link', { name: /Your Tackline sign-in link/ })
		.first()
		.click();
	await expect(page).toHaveURL(/\/dev\/inbox\/[a-z0-9-]+$/);
	await expect(page.getByRole('definition').filter({ hasText: 'customer@tackline.test' })).toBeVisible();
	await page.getByRole('link', { name: /\/auth\/callback\/nodemailer/ }).click();
	await expect(page).toHaveURL(/\/commissions$/);
});

test('a customer is kept out of the tailor workroom', async ({ page }) => {
	await signInWithPassword(page, 'customer@tackline.test', 'tackline-demo');
	await expect(page).toHaveURL(/\/commissions$/);
	expect((await page.goto('/dev/inbox'))?.status()).toBe(403);
	const response = await page.goto('/workroom');
	expect(response?.status()).toBe(403);
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('That page isn’t open to your account');
	await expect(page.getByRole('link', { name: 'Back to the home page' })).toBeVisible();
});

test('the admin reaches the desk', async ({ page }) => {
	await signInWithPassword(page, 'admin@tackline.test', 'tackline-demo');
	await expect(page).toHaveURL(/\/desk$/);
	await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
	expect((await page.goto('/commissions'))?.status()).toBe(403);
});
