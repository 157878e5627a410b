import { expect, test } from '@playwright/test';
import { signInWithPassword } from './helpers';

// Signing in hashes a password; give a busy machine room.
test.setTimeout(120_000);
const after = expect.configure({ timeout: 30_000 });

// Read-only on the demo customer's trousers (three quotes): the dialog is opened and left, nothing is decided,
// so the demo data stays as other browser tests expect it.
for (const width of [390, 1280]) {
	test.describe(`at ${width} px`, () => {
		test.use({ viewport: { width, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': `198.19.9.${width % 250}` } });

		test('a customer compares quotes, sorts them and opens the acceptance without deciding', async ({ page }) => {
			await signInWithPassword(page, 'customer@tackline.test', 'tackline-demo');
			await page.goto('/commissions');
			await page
				.getByRole('link', { name: /High-waisted wide-leg trousers/ })
				.first()
				.click();

			const quotes = page.getByRole('region', { name: 'Compare quotes' });
			await after(quotes.getByText('3 quotes waiting for your answer.')).toBeVisible();
			await expect(quotes.getByText('Our suggestion.')).toBeVisible();
			await quotes.getByText('How the best fit is worked out').click();
			await expect(quotes.getByText(/On time: 3 points/)).toBeVisible();

			const cards = quotes.getByRole('article');
			await expect(cards).toHaveCount(3);
			await quotes.getByRole('navigation', { name: 'Sort quotes by' }).getByRole('link', { name: 'Price' }).click();
			await after(page).toHaveURL(/sort=price/);
			const prices = await cards.getByTestId('quote-price').allTextContents();
			expect(prices).toEqual(['€134', '€158', '€172']);

			await cards.first().getByRole('link', { name: 'Accept…' }).click();
			const dialog = page.getByRole('dialog', { name: 'Accept this quote?' });
			await after(dialog).toBeVisible();
			await expect(dialog).toContainText('You pay €134');
			await expect(dialog).toContainText('Tackline’s fee of €13.40 (10 %) comes out of that price');
			await expect(dialog).toContainText('Payment comes next');
			// Escape leaves the confirmation without accepting.
			await page.keyboard.press('Escape');
			await after(dialog).toBeHidden();
			await expect(page).not.toHaveURL(/accept=/);
			await expect(quotes.getByText('3 quotes waiting for your answer.')).toBeVisible();

			await cards.nth(1).getByText('Decline…').click();
			await expect(cards.nth(1).getByLabel(/Reason for .* \(optional\)/)).toBeVisible();
		});
	});
}
