import { expect, test } from '@playwright/test';
import { signInWithPassword } from './helpers';

test('a tailor finds open commissions near the workroom and narrows them without a reload', async ({ page }) => {
	await signInWithPassword(page, 'tailor@tackline.test', 'tackline-demo');
	await page.goto('/workroom');
	const nearYou = page.getByRole('region', { name: 'Near you' });
	await expect(nearYou.getByRole('article').first()).toBeVisible();
	await expect(nearYou.getByText(/km away/).first()).toBeVisible();
	await nearYou.getByRole('link', { name: /See all open commissions/ }).click();

	await expect(page).toHaveURL(/\/workroom\/commissions$/);
	await expect(page.getByRole('heading', { level: 1, name: 'Open commissions near you' })).toBeVisible();
	const results = page.getByRole('region', { name: 'Results' });
	await expect(results.getByRole('article').first()).toBeVisible();

	// A marker survives only if the page is not loaded again.
	await page.evaluate(() => ((window as unknown as { stayed: boolean }).stayed = true));
	const answered = page.waitForResponse((response) => response.url().includes('/api/v1/commissions?'));
	await page.getByLabel('Garment').selectOption({ label: 'Loose tunic / kaftan' });
	expect((await answered).status()).toBe(200);
	await expect(page).toHaveURL(/garment=tunic/);
	await expect(results.getByRole('article').first()).toBeVisible();
	const garments = await results
		.getByRole('article')
		.evaluateAll((cards) => cards.map((card) => card.querySelector('dd')?.textContent));
	expect(new Set(garments)).toEqual(new Set(['Loose tunic / kaftan']));
	expect(await page.evaluate(() => (window as unknown as { stayed?: boolean }).stayed)).toBe(true);

	await page.getByLabel('Words in the title or notes').fill('no such words anywhere');
	await expect(results.getByRole('heading', { name: 'No open commissions match' })).toBeVisible();
	await expect(page).toHaveURL(/q=no\+such\+words\+anywhere/);
	await page.screenshot({ path: 'test-results/search-near-empty.png', fullPage: true });
});

test.describe('without JavaScript', () => {
	test.use({ javaScriptEnabled: false });

	test('the filters are a plain form and the list pages on', async ({ page }) => {
		await signInWithPassword(page, 'tailor@tackline.test', 'tackline-demo');
		await page.goto('/workroom/commissions?radiusKm=200');
		await page.getByLabel('Order').selectOption({ label: 'Newest first' });
		await page.getByRole('button', { name: 'Show commissions' }).click();
		await expect(page).toHaveURL(/sort=newest/);
		const results = page.getByRole('region', { name: 'Results' });
		await expect(results.getByRole('article').first()).toBeVisible();
		const more = page.getByRole('link', { name: 'More commissions' });
		if (await more.count()) {
			await more.click();
			await expect(page).toHaveURL(/cursor=/);
			await expect(page.getByRole('link', { name: 'Back to the start' })).toBeVisible();
		}
	});
});
