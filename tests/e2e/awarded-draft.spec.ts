import { expect, test } from '@playwright/test';
import { signInWithPassword } from './helpers';

// Signing in hashes a password, and nesting a draft takes up to two seconds: give a busy machine room.
test.setTimeout(120_000);
const after = expect.configure({ timeout: 30_000 });

test.use({ viewport: { width: 1280, height: 900 }, extraHTTPHeaders: { 'x-forwarded-for': '198.19.12.41' } });

/** The demo tailor's orders, as the orders board links them. */
async function orderLinks(page: import('@playwright/test').Page) {
	await page.goto('/workroom/orders');
	const hrefs = await page.locator('a[href^="/orders/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href')!));
	return [...new Set(hrefs)];
}

test('the awarded tailor’s order page comes at once, and the cutting draft follows when it is nested', async ({
	page
}) => {
	await signInWithPassword(page, 'tailor@tackline.test', 'tackline-demo');
	const [first] = await orderLinks(page);
	await page.goto(first);
	await expect(page.getByRole('heading', { name: 'Cutting draft' })).toBeVisible();
	// Working out, then the draft itself, without a reload.
	await after(page.getByRole('heading', { name: 'Fabric to buy' })).toBeVisible();
	await expect(page.getByTestId('draft-pending')).toHaveCount(0);
	await expect(page.getByTestId('fabric-length')).toBeVisible();
	// Worked out once, it comes with the page.
	await page.reload();
	await expect(page.getByTestId('fabric-length')).toBeVisible();
});

test.describe('without JavaScript', () => {
	test.use({ javaScriptEnabled: false });

	test('the page says the draft is being worked out, and a reload shows it', async ({ page }) => {
		await signInWithPassword(page, 'tailor@tackline.test', 'tackline-demo');
		const links = await orderLinks(page);
		await page.goto(links[links.length - 1]);
		await expect(page.getByRole('heading', { name: 'Cutting draft' })).toBeVisible();
		await after(async () => {
			await page.reload();
			await expect(page.getByTestId('fabric-length')).toBeVisible({ timeout: 1000 });
		}).toPass({ timeout: 30_000 });
		await expect(page.getByTestId('draft-pending')).toHaveCount(0);
	});
});
