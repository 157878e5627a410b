import { expect, test, type Page } from '@playwright/test';
import { solid } from '../factories/images';
import { signUp, uniqueEmail } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.71' } });
// Signing up hashes a password and the setup saves four forms; give a busy machine room.
test.setTimeout(120_000);

async function saveAndContinue(page: Page, next: RegExp) {
	await page.getByRole('button', { name: 'Save and continue' }).click();
	await expect(page).toHaveURL(next, { timeout: 15_000 });
}

for (const width of [390, 1280]) {
	test(`a new tailor sets up a workroom and sees its public page (${width} px)`, async ({ page }) => {
		await page.setViewportSize({ width, height: 900 });
		const name = `Heron Quay Tailoring ${width}`;
		const email = uniqueEmail(`onboarding${width}`);
		await signUp(page, 'tailor', email, 'spool lantern harbour meadow');

		await expect(page.getByText('0 of 8 steps done')).toBeVisible();
		await page.getByRole('link', { name: /Your workroom’s name/ }).click();

		await page.getByLabel('Workroom name').fill(name);
		await page.getByRole('combobox', { name: 'Town name' }).fill('Loomsi');
		await page.getByRole('option', { name: /Loomside/ }).click();
		await expect(page.getByTestId('place-chosen')).toContainText('Loomside');
		await page.getByLabel('How far you serve (km)').fill('10');
		await page.getByLabel('Orders you take on at once').fill('3');
		await saveAndContinue(page, /\/workroom\/setup\/about$/);

		await page
			.getByLabel('About your workroom')
			.fill('Wide-leg trousers and straight skirts, cut from your own measurements and fitted twice.');
		await saveAndContinue(page, /\/workroom\/setup\/garments$/);

		await page.getByRole('checkbox', { name: 'Straight skirt' }).check();
		await page.getByRole('checkbox', { name: 'Wide-leg high-waisted trousers' }).check();
		await page.getByRole('spinbutton', { name: 'Typical lead time (days) for Straight skirt' }).fill('10');
		await saveAndContinue(page, /\/workroom\/setup\/garments$/);
		await expect(page.getByText('Give a typical lead time in days.')).toBeVisible();
		await expect(page.getByRole('checkbox', { name: 'Straight skirt' })).toBeChecked();
		await expect(page.getByRole('spinbutton', { name: 'Typical lead time (days) for Straight skirt' })).toHaveValue(
			'10'
		);
		await page
			.getByRole('spinbutton', { name: 'Typical lead time (days) for Wide-leg high-waisted trousers' })
			.fill('16');
		await saveAndContinue(page, /\/workroom\/setup\/rates$/);

		await page.getByLabel('Hourly rate for your labour').fill('32.50');
		await page.getByLabel('Currency').selectOption('EUR');
		await page.getByLabel('Mark-up on fabric you buy for a customer (%)').fill('12');
		await expect(page.getByLabel('Straight skirt')).toHaveValue('5');
		await saveAndContinue(page, /\/workroom\/portfolio$/);

		await page.getByLabel('Caption', { exact: true }).first().fill('Brown herringbone trousers');
		await page.getByRole('button', { name: 'Add piece' }).click();
		const picker = page.getByLabel(/Drop photos here/);
		await expect(picker).toBeVisible({ timeout: 15_000 });
		await picker.setInputFiles([
			{ name: 'trousers.png', mimeType: 'image/png', buffer: await solid(120, 160).png().toBuffer() }
		]);
		const bar = page.getByRole('progressbar', { name: 'Uploading trousers.png' });
		await expect(bar).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
		await expect(page.getByText('1 of 12').first()).toBeVisible({ timeout: 15_000 });
		await page.goto('/workroom');
		await expect(page.getByRole('heading', { name: `${name} is open` })).toBeVisible();
		await page.getByRole('link', { name: 'See your public page' }).click();

		await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
		await expect(page.getByText('Loomside, Merrowgate')).toBeVisible();
		await expect(page.locator('img[src^="/photos/"]').first()).toBeVisible();
		await page.screenshot({ path: `test-results/workroom-public-${width}.png`, fullPage: true });
		await expect(page.getByText('about 16 days')).toBeVisible();
		await expect(page.getByText('No reviews yet.')).toBeVisible();
		await expect(page.getByText('Meet at the workroom or in a public place')).toBeVisible();
	});
}
