import { expect, test } from '@playwright/test';
import { signInWithPassword } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.24' } });
// Signing up or in hashes a password; give a busy machine room.
test.setTimeout(90_000);

test('visitors are offered both sides in our own words', async ({ page }) => {
	await page.goto('/');
	const hero = page.locator('section').first();
	await expect(hero.getByRole('link', { name: 'Commission a garment' })).toBeVisible();
	await expect(hero.getByRole('link', { name: 'I make clothes: find commissions' })).toBeVisible();
	await expect(page.getByRole('main')).not.toContainText(/find work|I’m a tailor/i);
	await expect(page.getByRole('banner').getByRole('link', { name: 'Create account' })).toBeVisible();
});

test('a signed-in customer is pointed to their commissions, not to sign-up', async ({ page }) => {
	await signInWithPassword(page, 'customer@tackline.test', 'tackline-demo');
	await expect(page).toHaveURL(/\/commissions$/);
	await page.goto('/');
	await expect(page.locator('a[href^="/sign-up"]')).toHaveCount(0);
	await expect(page.getByRole('link', { name: 'Go to my commissions' }).first()).toBeVisible();
	await expect(page.getByRole('main')).not.toContainText('I make clothes');
	await page.goto('/how-it-works');
	await expect(page.locator('a[href^="/sign-up"]')).toHaveCount(0);
});

test('the admin area is the Desk, with its Disputes', async ({ page }) => {
	await signInWithPassword(page, 'admin@tackline.test', 'tackline-demo');
	await expect(page).toHaveURL(/\/desk$/);
	await expect(page).toHaveTitle('Desk · Tackline');
	await expect(
		page.getByRole('navigation', { name: 'Main' }).first().getByRole('link', { name: 'Desk' })
	).toBeVisible();
	await expect(page.getByRole('heading', { name: 'Disputes', exact: true })).toBeVisible();
	await expect(page.locator('body')).not.toContainText(/resolution/i);
});
