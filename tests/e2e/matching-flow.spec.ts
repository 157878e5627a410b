import { expect, test, type Browser } from '@playwright/test';
import { signInWithPassword } from './helpers';

// Signing in hashes a password, and the index follows a publish by about a second: give a busy machine room.
test.setTimeout(240_000);
const soon = expect.configure({ timeout: 30_000 });

async function signedInPage(browser: Browser, email: string, address: string) {
	const context = await browser.newContext({
		viewport: { width: 1280, height: 900 },
		extraHTTPHeaders: { 'x-forwarded-for': address }
	});
	const page = await context.newPage();
	await signInWithPassword(page, email, 'tackline-demo');
	return page;
}

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

test('a tailor finds a commission near them and quotes; the customer accepts; both talk live', async ({ browser }) => {
	const customer = await signedInPage(browser, 'customer@tackline.test', '198.19.10.21');
	const tailor = await signedInPage(browser, 'tailor@tackline.test', '198.19.10.22');
	const title = `Rust corduroy skirt ${Date.now()}`;

	// The customer's commission, posted through the API in their session (the steps have their own test).
	const profile = await customer.request.post('/api/v1/measurement-profiles', {
		data: { label: `For the ${title}`, unit: 'cm', values: { waist_girth: 74, hip_girth: 100, waist_to_hip: 20.5 } }
	});
	expect(profile.status()).toBe(201);
	const created = await customer.request.post('/api/v1/commissions', {
		data: {
			garment: 'straight-skirt',
			title,
			styleNotes: 'Knee length with a back vent.',
			measurementProfileId: (await profile.json()).id,
			fabricSource: 'tailor_sources',
			budget: { minMinor: 9000, maxMinor: 18000, currency: 'EUR' },
			dateNeeded: inDays(70),
			location: { lat: 46.8466, lng: 3.2034, name: 'Merrowgate', country: 'FR' },
			handover: 'pickup'
		}
	});
	expect(created.status()).toBe(201);
	const commissionId = (await created.json()).id as string;
	expect((await customer.request.post(`/api/v1/commissions/${commissionId}/publish`)).status()).toBe(200);

	// The tailor finds it near the workroom by its words, then prices it with the helper.
	await tailor.goto('/workroom/commissions');
	const results = tailor.getByRole('region', { name: 'Results' });
	await soon(async () => {
		await tailor.getByLabel('Words in the title or notes').fill(title.split(' ').at(-1)!);
		await expect(results.getByRole('article')).toHaveCount(1, { timeout: 3000 });
	}).toPass({ timeout: 30_000 });
	await expect(results.getByRole('article')).toContainText(/km away/);
	await results.getByRole('link', { name: title }).click();
	await tailor.getByRole('link', { name: 'Price it and send a quote' }).click();
	await soon(tailor.getByRole('heading', { name: 'Quote helper' })).toBeVisible();
	await tailor.getByLabel('Labour (hours)').fill('8');
	await tailor.getByLabel('Hourly rate (EUR)').fill('30');
	await tailor.getByRole('button', { name: 'Use this total as my price' }).click();
	await tailor.getByLabel('Delivery by').fill(inDays(45));
	await tailor.getByLabel('Message to the customer').fill('Needlecord from the shelf; one fitting at the workroom.');
	await tailor.getByRole('button', { name: 'Send the quote' }).click();
	await soon(tailor.getByText('Quote sent.', { exact: false })).toBeVisible();
	const price = await tailor.getByLabel('Your price (EUR)').inputValue();

	// The customer compares (one quote) and accepts it.
	await customer.goto(`/commissions/${commissionId}`);
	const quotes = customer.getByRole('region', { name: 'Compare quotes' });
	await soon(quotes.getByRole('article')).toHaveCount(1);
	await expect(quotes.getByTestId('quote-price')).toContainText(price.replace(/\.00$/, ''));
	await quotes.getByRole('link', { name: 'Accept…' }).click();
	const dialog = customer.getByRole('dialog', { name: 'Accept this quote?' });
	await soon(dialog).toBeVisible();
	await dialog.getByRole('button', { name: /^Yes, accept/ }).click();
	await soon(customer.getByText(/awaiting payment/i).first()).toBeVisible();
	await customer.screenshot({ path: 'test-results/matching-flow-accepted.png', fullPage: true });

	// Both open the conversation and see each other's messages arrive without a reload.
	await customer.getByRole('link', { name: /^Messages with / }).click();
	await soon(customer.getByText('Live', { exact: true })).toBeVisible();
	await tailor.goto(`/commissions/${commissionId}`);
	await tailor.getByRole('link', { name: 'Open the conversation' }).click();
	await soon(tailor.getByText('Live', { exact: true })).toBeVisible();

	const note = `Could the fitting be on a Saturday? ${Date.now()}`;
	await customer.getByLabel('Your message').fill(note);
	await customer.getByRole('button', { name: 'Send' }).click();
	await soon(tailor.getByRole('log', { name: 'Messages' }).getByText(note)).toBeVisible();
	const reply = `Saturday at ten suits the workroom. ${Date.now()}`;
	await tailor.getByLabel('Your message').fill(reply);
	await tailor.getByRole('button', { name: 'Send' }).click();
	await soon(customer.getByRole('log', { name: 'Messages' }).getByText(reply)).toBeVisible();
	await tailor.screenshot({ path: 'test-results/matching-flow-messages.png', fullPage: true });

	await customer.context().close();
	await tailor.context().close();
});
