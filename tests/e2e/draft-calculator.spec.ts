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

test('stops on a likely unit mix-up and drafts after one click on the offered unit', async ({ page }) => {
	await page.goto('/draft-calculator?garment=a-line-skirt&unit=cm');
	// The EN 13402-3 body 88-72-96 cm typed in inches into the centimetre form.
	await field(page, 'Waist').fill('28 1/4');
	await field(page, 'Hip').fill('37 3/4');
	await field(page, 'Waist to hip').fill('8 1/8');
	const question = page.getByTestId('unit-question');
	await expect(question).toContainText('These look like inches');
	await expect(page.getByRole('img', { name: /^Front: Cut 1 on fold/ })).toHaveCount(0);
	await expect(field(page, 'Hip')).toHaveAccessibleDescription(/looks like inches/);
	await question.getByRole('button', { name: 'Switch to inches, keep the numbers' }).click();
	await expect(page.getByRole('radio', { name: 'Inches' })).toBeChecked();
	await expect(field(page, 'Hip')).toHaveValue('37 3/4');
	await expect(page.getByRole('img', { name: /^Front: Cut 1 on fold/ })).toBeVisible();
});

test('drafts the numbers as typed once the person says the unit is right', async ({ page }) => {
	await page.goto('/draft-calculator?garment=a-line-skirt&unit=cm');
	await field(page, 'Waist').fill('72');
	await field(page, 'Hip').fill('38');
	await field(page, 'Waist to hip').fill('20.6');
	await page.getByRole('button', { name: 'They are centimetres' }).click();
	await expect(page.getByRole('img', { name: /^Front: Cut 1 on fold/ })).toBeVisible();
	await expect(page.getByText(/Hip 38 cm looks like inches typed into a centimetre field/).first()).toBeVisible();
});

test('on a 360 px phone in centimetres: no alert before typing, metric allowances, cloth numbers explained', async ({
	page
}) => {
	await page.setViewportSize({ width: 360, height: 780 });
	await page.goto('/draft-calculator?garment=straight-skirt&unit=cm');
	await expect(page.getByRole('alert')).toHaveCount(0);
	await page.getByText('Allowances and details').click();
	// Metric patterns give the seam as 1.5 cm (common practice), not 1.6 cm for ⅝ in.
	await expect(page.getByLabel('Seam allowance')).toHaveAttribute('placeholder', '1.5');
	await expect(page.getByText(/0\.5–3\.5 cm\./).first()).toBeVisible();
	await page.getByRole('button', { name: 'Fill in a worked example' }).click();
	await expect(page.getByRole('radio', { name: 'Centimetres' })).toBeChecked();
	await expect(page.getByTestId('fabric-explained')).toContainText('the pieces take');
	await expect(page.getByTestId('fabric-explained')).toContainText('buying step');
	// The long band forces the cloth longer whole; the layout cuts it in two and says so.
	await expect(page.getByText(/Waistband: cut in two pieces, each half the length plus 1\.5 cm to join/)).toBeVisible();
	const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
	expect(overflow).toBeLessThanOrEqual(0);
});

test('shows the neck-cord caution on the tunic', async ({ page }) => {
	await page.goto('/draft-calculator?garment=tunic');
	await page.getByRole('button', { name: 'Fill in a worked example' }).click();
	await expect(page.getByText(/EN 14682/)).toBeVisible();
	await expect(page.getByRole('button', { name: 'Print cut sheet' })).toBeVisible();
});

test('drafts the lined waistcoat: button count and breast pocket as chosen, lining laid apart', async ({ page }) => {
	await page.goto('/draft-calculator?garment=waistcoat');
	await page.getByRole('button', { name: 'Fill in a worked example' }).click();
	await expect(page.getByRole('img', { name: /^Front lining: Cut 2 \(a pair\) in lining/ })).toBeVisible();
	await expect(page.getByText(/^Lining \(front lining/)).toBeVisible();
	await expect(page.getByRole('checkbox', { name: /Breast welt pocket/ })).toBeChecked();
	await page.getByRole('checkbox', { name: /Breast welt pocket/ }).uncheck();
	await expect(page.getByRole('img', { name: /^Breast welt:/ })).toHaveCount(0);
	await page.getByLabel('Buttons').selectOption('6');
	await expect(page.getByText(/^6 buttons;/)).toBeVisible();
});

test('on a 360 px phone the drawings read at 11 px or more and zoom by pinch, keys and buttons', async ({ page }) => {
	await page.setViewportSize({ width: 360, height: 780 });
	await page.goto('/draft-calculator?garment=wide-leg-trousers&unit=in');
	await page.getByRole('button', { name: 'Fill in a worked example' }).click();
	const drawing = page.getByRole('img', { name: /^Front: Cut 2/ });
	await expect(drawing).toBeVisible();
	const smallest = await drawing.evaluate((svg) => {
		const scale = (svg as SVGSVGElement).getScreenCTM()!.a;
		const sizes = [...svg.querySelectorAll('text[fill="#24495a"]')].map((t) => Number(t.getAttribute('font-size')));
		return Math.min(...sizes) * scale;
	});
	expect(smallest).toBeGreaterThanOrEqual(11);

	const frame = page.getByTestId('piece-zoom').first();
	await frame.focus();
	await page.keyboard.press('+');
	await expect(frame).toHaveAttribute('data-scale', '1.25');
	await page.getByRole('button', { name: 'Reset the view of Front' }).click();
	await expect(frame).toHaveAttribute('data-scale', '1.00');

	// Two fingers 40 px apart spread to 120 px: three times the size.
	const box = (await frame.boundingBox())!;
	const y = box.y + box.height / 2;
	const x = box.x + box.width / 2;
	const touch = (type: string, pointerId: number, clientX: number) =>
		frame.dispatchEvent(type, { pointerId, pointerType: 'touch', isPrimary: pointerId === 1, clientX, clientY: y });
	await touch('pointerdown', 1, x - 20);
	await touch('pointerdown', 2, x + 20);
	await touch('pointermove', 1, x - 60);
	await touch('pointermove', 2, x + 60);
	await touch('pointerup', 1, x - 60);
	await touch('pointerup', 2, x + 60);
	await expect(frame).toHaveAttribute('data-scale', '3.00');
	await page.getByRole('button', { name: 'Zoom out of Front' }).click();
	await expect(frame).toHaveAttribute('data-scale', '2.00');
});
