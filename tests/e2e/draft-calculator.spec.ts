import { expect, test, type Page } from '@playwright/test';

/** A required measurement field by its label; its accessible name ends in "(required)". */
const field = (page: Page, label: string) => page.getByRole('textbox', { name: `${label} (required)`, exact: true });

test('draft trousers from measurements, switch units and see the drawings', async ({ page }) => {
	await page.goto('/draft-calculator');
	await expect(page.getByRole('heading', { level: 1, name: 'Draft calculator' })).toBeVisible();

	await page.getByRole('radio', { name: /Wide-leg high-waisted trousers/ }).check();
	await page.getByRole('radio', { name: 'Inches' }).check();

	// The working dressmaker's trouser method (common practice): hip 40 → width at hip line 11.
	await field(page, 'Hip').fill('40');
	await field(page, 'Waist').fill('28');
	await field(page, 'Thigh').fill('25');
	await page.getByLabel('Finished length (top of waistband to hem)').fill('45 1/2');

	const front = page.getByRole('table', { name: /^Front/ });
	await expect(front.getByRole('row', { name: /Width at hip line/ }).getByRole('cell')).toHaveText('11 in');
	await expect(front.getByRole('row', { name: /Crotch depth/ }).getByRole('cell')).toHaveText('11 1/2 in');
	await expect(front.getByRole('row', { name: /Leg length with hem/ }).getByRole('cell')).toHaveText('46 in');
	await expect(page.getByTestId('fabric-length')).toHaveText(/yd$/);

	const frontDrawing = page.getByRole('img', { name: /^Front: Cut 2/ });
	await expect(frontDrawing).toBeVisible();
	await expect(frontDrawing).toContainText('11 in');
	await expect(page.getByRole('img', { name: /^Layout on 45 in cloth/ })).toBeVisible();

	await page.getByRole('radio', { name: 'Centimetres' }).check();
	await expect(field(page, 'Hip')).toHaveValue('101.6');
	await expect(front.getByRole('row', { name: /Width at hip line/ }).getByRole('cell')).toHaveText('27.9 cm');
	await expect(frontDrawing).toContainText('27.9 cm');
	await expect(page.getByTestId('fabric-length')).toHaveText(/ m$/);
});

test('warns live about a likely unit mix-up without blocking the draft', async ({ page }) => {
	await page.goto('/draft-calculator?garment=a-line-skirt&unit=cm');
	await field(page, 'Waist').fill('72');
	await field(page, 'Hip').fill('38');
	await field(page, 'Waist to hip').fill('20.6');
	await expect(page.getByText(/Hip 38 cm looks like inches typed into a centimetre field/).first()).toBeVisible();
	await expect(page.getByRole('img', { name: /^Front: Cut 1 on fold/ })).toBeVisible();
	await expect(field(page, 'Hip')).toHaveAccessibleDescription(/looks like inches/);
});

test('shows the neck-cord caution on the tunic', async ({ page }) => {
	await page.goto('/draft-calculator?garment=tunic');
	await page.getByRole('button', { name: 'Fill in a worked example' }).click();
	await expect(page.getByText(/EN 14682/)).toBeVisible();
	await expect(page.getByRole('button', { name: 'Print cut sheet' })).toBeVisible();
});
