import { expect, test } from '@playwright/test';
import { signInWithPassword } from './helpers';

// Signing in hashes a password; give a busy machine room.
test.setTimeout(180_000);
const after = expect.configure({ timeout: 30_000 });

// The demo's open shift dress (commission 4): the demo workroom makes shift dresses and has not quoted on it.
const shiftDress = '5eed0000-0000-4000-8000-000300000004';

function isoDaysAhead(days: number) {
	return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

for (const width of [390, 1280]) {
	test.describe(`at ${width} px`, () => {
		test.use({ viewport: { width, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': `198.19.9.${width % 250}` } });

		test('a tailor prices a commission with the helper, sends the quote and withdraws it', async ({ page }) => {
			await signInWithPassword(page, 'tailor@tackline.test', 'tackline-demo');
			await page.goto(`/commissions/${shiftDress}`);
			await page.getByRole('link', { name: 'Price it and send a quote' }).click();
			await after(page.getByRole('heading', { name: 'Quote helper' })).toBeVisible();

			const total = page.getByRole('row', { name: /^Total/ });
			const before = await total.textContent();
			await page.getByLabel('Labour (hours)').fill('20');
			await page.getByLabel('Hourly rate (EUR)').fill('30');
			// 20 h × 30.00 EUR: the labour line and the total follow as the figures change.
			await expect(page.getByRole('row', { name: /^Labour/ })).toContainText('20 h × 30.00 EUR');
			await expect(page.getByRole('row', { name: /^Labour/ })).toContainText('€600');
			await expect(total).not.toHaveText(before ?? '');
			await page.getByRole('button', { name: 'Use this total as my price' }).click();
			const totalText = (await total.textContent())!.replace(/[^\d.]/g, '');
			expect(Number(await page.getByLabel('Your price (EUR)').inputValue())).toBe(Number(totalText));

			// A date after the one the customer needs is a warning, never a refusal.
			await page.getByLabel('Delivery by').fill(isoDaysAhead(90));
			await expect(page.getByText(/after the date the customer needs it/)).toBeVisible();
			await page.getByLabel('Message to the customer').fill('Fully lined; two fittings at the workroom.');
			await page.getByRole('button', { name: 'Send the quote' }).click();
			await after(page.getByText('Quote sent.', { exact: false })).toBeVisible();
			await expect(page.getByRole('button', { name: 'Save the changes' })).toBeVisible();

			await page.getByRole('link', { name: 'Withdraw…' }).click();
			await page.getByRole('button', { name: 'Yes, withdraw it' }).click();
			await after(page.getByText('Quote withdrawn.', { exact: false })).toBeVisible();
			await expect(page.getByRole('button', { name: 'Send the quote' })).toBeVisible();
		});
	});
}
