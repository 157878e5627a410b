import { expect, test } from '@playwright/test';
import { createDb } from '../../src/lib/server/db/client';
import { createCommission, createUser } from '../factories';
import { htmlPage, solid } from '../factories/images';
import { signInWithPassword } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.71' } });
// Signing in hashes a password and every upload is re-encoded: give a busy machine room.
test.setTimeout(90_000);

/** A customer with a draft commission of their own, made straight in the browser tests' database. */
async function customerWithDraft() {
	const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 1 });
	try {
		const customer = await createUser(db, { name: 'Bettany Quine' });
		const draft = await createCommission(db, { status: 'draft', customerId: customer.id });
		return { customer, draft };
	} finally {
		await pool.end();
	}
}

for (const width of [390, 1280]) {
	test(`the photo step uploads two photos with a progress bar each at ${width} px`, async ({ page }) => {
		await page.setViewportSize({ width, height: 900 });
		const { customer, draft } = await customerWithDraft();
		await signInWithPassword(page, customer.email, customer.password);
		await page.goto(`/commissions/${draft.id}/edit/photos`);
		await expect(page.getByRole('heading', { name: 'Reference photos' })).toBeVisible();
		await expect(page.getByText('0 of 8')).toBeVisible();
		// Shown once the page is interactive: uploads then go one by one, with progress.
		const picker = page.getByLabel(/Drop photos here/);
		await expect(picker).toBeVisible();

		await picker.setInputFiles([
			{ name: 'fabric.png', mimeType: 'image/png', buffer: await solid(120, 80).png().toBuffer() },
			{ name: 'sketch.jpg', mimeType: 'image/jpeg', buffer: await solid(80, 120).jpeg().toBuffer() },
			{ name: 'notes.jpg', mimeType: 'image/jpeg', buffer: htmlPage() }
		]);

		for (const name of ['fabric.png', 'sketch.jpg']) {
			const bar = page.getByRole('progressbar', { name: `Uploading ${name}` });
			await expect(bar).toBeVisible();
			await expect(bar).toHaveAttribute('aria-valuenow', '100', { timeout: 30_000 });
		}
		const refused = page.locator('[data-upload-state="refused"]', { hasText: 'notes.jpg' });
		await expect(refused).toContainText('holds text (such as a web page)', { timeout: 30_000 });
		await expect(page.getByText('2 of 8')).toBeVisible();

		const photos = page.getByRole('list', { name: 'Photos in order' }).getByRole('listitem');
		await expect(photos).toHaveCount(2);
		await expect(photos.first()).toContainText('120 × 80 px');

		await page.getByRole('button', { name: 'Move photo 2 earlier' }).click();
		await expect(photos.first()).toContainText('80 × 120 px');

		await page.getByLabel('Describe photo 1').fill('Sketch of the neckline');
		// Reload only once the description is stored (a reload would otherwise cut the request short).
		const saved = page.waitForResponse((r) => r.request().method() === 'POST' && r.url().includes('/altText'));
		await photos.first().getByRole('button', { name: 'Save' }).click();
		expect((await saved).ok()).toBe(true);
		await page.reload();
		await expect(page.getByLabel('Describe photo 1')).toHaveValue('Sketch of the neckline');
		await expect(photos.first().getByRole('img', { name: 'Sketch of the neckline' })).toBeVisible();

		const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
		expect(overflow).toBeLessThanOrEqual(0);
	});
}
