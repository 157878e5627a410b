import { expect, test } from '@playwright/test';
import { signUp, uniqueEmail } from './helpers';

test.use({ timezoneId: 'America/Sao_Paulo', extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.21' } });
// Signing up or in hashes a password; give a busy machine room.
test.setTimeout(90_000);

test('a new account starts in the browser’s time zone, and its first save works', async ({ page }) => {
	await signUp(page, 'customer', uniqueEmail('zone'), 'amber thimbles fold quietly');
	await page.goto('/account');

	const zone = page.getByLabel('Time zone');
	await expect(zone).toHaveValue('America/Sao_Paulo');
	await expect(zone.locator('option:checked')).toHaveText('Sao Paulo (UTC-03:00)');
	await expect(zone.locator('optgroup[label="Europe"] option', { hasText: 'London (UTC' })).toHaveCount(1);

	await page.getByRole('button', { name: 'Save changes' }).click();
	await expect(page.getByText('Saved.')).toBeVisible();
	await page.reload();
	await expect(page.getByLabel('Time zone')).toHaveValue('America/Sao_Paulo');
});
