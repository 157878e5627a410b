import { expect, test } from '@playwright/test';
import { solid } from '../factories/images';
import { signInWithPassword } from './helpers';

// Signing in hashes a password; give a busy machine room.
test.setTimeout(180_000);
// Each step saves on the server before the next page loads; a busy machine takes its time.
const after = expect.configure({ timeout: 30_000 });

function isoDaysAhead(days: number) {
	return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

for (const width of [390, 1280]) {
	test.describe(`at ${width} px`, () => {
		test.use({ viewport: { width, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': `198.19.7.${width % 250}` } });

		test('a customer posts a commission through the steps and publishes it', async ({ page }) => {
			const title = `Needlecord skirt ${width}`;
			await signInWithPassword(page, 'nadia.kestrel@tackline.test', 'tackline-demo');
			await page.goto('/commissions');
			await page.getByRole('link', { name: 'New commission' }).click();

			await page.getByLabel('A-line skirt').check();
			await page.getByLabel('Title').fill(title);
			await page.getByLabel('Style notes').fill('Midi length, deep pockets.');
			await page.getByRole('button', { name: 'Save and continue' }).click();
			await page.waitForURL(/\/edit\/photos$/, { waitUntil: 'commit', timeout: 30_000 });

			await after(page.getByText('0 of 8')).toBeVisible();
			const picker = page.getByLabel(/Drop photos here/);
			await picker.setInputFiles([
				{ name: 'swatch.png', mimeType: 'image/png', buffer: await solid(160, 100).png().toBuffer() },
				{ name: 'pocket.jpg', mimeType: 'image/jpeg', buffer: await solid(100, 160).jpeg().toBuffer() }
			]);
			for (const name of ['swatch.png', 'pocket.jpg']) {
				const bar = page.getByRole('progressbar', { name: `Uploading ${name}` });
				await expect(bar).toBeVisible();
				await expect(bar).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
			}
			await after(page.getByText('2 of 8')).toBeVisible();
			await page.getByRole('link', { name: 'Next: measurements →' }).click();
			await after(page.getByText('Has everything this garment needs.')).toBeVisible();
			await page.getByRole('radio', { name: 'Me' }).check();
			await page.getByRole('button', { name: 'Save and continue' }).click();

			await after(page.getByRole('heading', { name: 'Fabric' })).toBeVisible();
			await page.getByLabel('The tailor sources it').check();
			await page.getByRole('button', { name: 'Save and continue' }).click();

			await after(page.getByRole('heading', { name: 'Budget and date' })).toBeVisible();
			await page.getByLabel('From').fill('90');
			await page.getByLabel('Up to').fill('60');
			await page.getByLabel('Needed by').fill(isoDaysAhead(50));
			await page.getByRole('button', { name: 'Save and continue' }).click();
			await after(page.getByText('The lowest amount must not be above the highest.')).toBeVisible();
			await expect(page.getByLabel('From')).toHaveValue('90');
			await page.getByLabel('Up to').fill('140');
			await page.getByRole('button', { name: 'Save and continue' }).click();

			await after(page.getByRole('heading', { name: 'Place and handover' })).toBeVisible();
			await page.getByLabel('Town name').fill('Ferrin Hill');
			await page.getByLabel('Country', { exact: true }).selectOption('FR');
			await page.getByLabel('I collect it from the workroom').check();
			await page.getByRole('button', { name: 'Save and review' }).click();

			await after(page.getByRole('heading', { name: 'Review and publish' })).toBeVisible();
			await expect(page.getByText('€90 – €140')).toBeVisible();
			await page.getByRole('button', { name: 'Publish commission' }).click();

			await after(page.getByText('Published. Tailors near you can now see it')).toBeVisible();
			await expect(page.getByText('Ferrin Hill')).toBeVisible();
			await expect(page.getByText('Open for quotes', { exact: true })).toBeVisible();
			await expect(page.getByRole('table')).toContainText('Waist');
			await expect(page.locator('img[src^="/photos/"]')).toHaveCount(2);
			await page.screenshot({ path: `test-results/commission-published-${width}.png`, fullPage: true });
		});
	});
}
