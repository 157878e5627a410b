import { expect, test } from '@playwright/test';
import { signUp, uniqueEmail } from './helpers';

// Signing up hashes a password; give a busy machine room.
test.setTimeout(90_000);

const screens = [
	{ width: 390, height: 844, address: '198.19.0.71' },
	{ width: 1280, height: 800, address: '198.19.0.72' }
];

for (const { width, height, address } of screens) {
	test.describe(`at ${width} px`, () => {
		test.use({ viewport: { width, height }, extraHTTPHeaders: { 'x-forwarded-for': address } });

		test('a customer makes a measurement profile in inches, checked as they type', async ({ page }) => {
			await signUp(page, 'customer', uniqueEmail('profile'), 'amber thimbles fold quietly');
			await page.goto('/measurements');
			await expect(page.getByRole('heading', { name: 'No measurements yet' })).toBeVisible();
			await page.getByRole('link', { name: 'Add measurements' }).click();

			await expect(page.getByRole('heading', { level: 1, name: 'New measurement profile' })).toBeVisible();
			await expect(page.getByText('parent or guardian')).toBeVisible();
			await page.getByLabel('Profile name').fill('Me');
			await page.getByRole('radio', { name: /^Someone else/ }).check();
			await page.getByRole('radio', { name: 'Inches' }).check();

			const hip = page.getByLabel('Hip', { exact: true });
			await hip.fill('100');
			await expect(page.getByText('looks like centimetres typed into an inch field').first()).toBeVisible();
			await hip.fill('40 3/8');
			await expect(page.getByText('looks like centimetres typed into an inch field')).toHaveCount(0);
			await page.getByLabel('Waist', { exact: true }).fill('30⅛');
			await page.getByLabel('Waist to hip', { exact: true }).fill('8.25');

			const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
			expect(overflow).toBeLessThanOrEqual(0);

			await page.getByRole('button', { name: 'Save profile' }).click();
			// Saving and loading the saved profile can take a while on a busy machine.
			await expect(page).toHaveURL(/\/measurements\/[0-9a-f-]{36}\?saved=1$/, { timeout: 20_000 });
			await expect(page.getByText('Saved.')).toBeVisible();
			await expect(page.getByLabel('Hip', { exact: true })).toHaveValue('40 3/8');
			await expect(page.getByLabel('Waist', { exact: true })).toHaveValue('30 1/8');

			await page.goto('/measurements');
			const row = page.getByTestId('profile-row').filter({ hasText: 'Me' });
			await expect(row).toContainText('3 measurements · in inches · taken by someone else');
		});
	});
}
