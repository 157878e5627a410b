import { expect, test } from '@playwright/test';

test('the measurement guide explains each measurement and shows ranges in either unit', async ({ page }) => {
	await page.goto('/measurement-guide');
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('How to take your measurements');
	const hip = page.locator('#hip_girth');
	await expect(hip).toContainText(/Most adults: \d+ cm to \d+ cm/);
	await page.getByText('Inches', { exact: true }).click();
	await expect(hip).toContainText(/Most adults: \d+ in to \d+ in/);
	await expect(page.getByText('Children and teenagers are measured with a parent or guardian present.')).toBeVisible();
});
