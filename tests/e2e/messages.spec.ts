import { expect, test, type Browser } from '@playwright/test';
import { signInWithPassword } from './helpers';

// Signing in hashes a password; give a busy machine room.
test.setTimeout(120_000);
const live = expect.configure({ timeout: 20_000 });

async function signedInPage(browser: Browser, email: string, address: string) {
	const context = await browser.newContext({ extraHTTPHeaders: { 'x-forwarded-for': address } });
	const page = await context.newPage();
	await signInWithPassword(page, email, 'tackline-demo');
	return page;
}

test('a customer and a tailor see each other’s messages arrive live, without reloading', async ({ browser }) => {
	const customer = await signedInPage(browser, 'customer@tackline.test', '198.19.9.11');
	const tailor = await signedInPage(browser, 'tailor@tackline.test', '198.19.9.12');

	// The demo tailor asked about the concert tunic; the customer's answer waits unread for them.
	await tailor.goto('/messages');
	await tailor.getByRole('link', { name: /Rosalind F\..*Concert tunic for my son/s }).click();
	await expect(tailor.getByRole('heading', { level: 1, name: 'Rosalind F.' })).toBeVisible();
	await live(tailor.getByText('Live', { exact: true })).toBeVisible();

	await customer.goto('/messages');
	await customer.getByRole('link', { name: /Obi Cut & Stitch.*Concert tunic for my son/s }).click();
	await live(customer.getByText('Live', { exact: true })).toBeVisible();

	const question = `Shall I use horn buttons? ${Date.now()} https://example.com/buttons`;
	await tailor.getByLabel('Your message').fill(question);
	await tailor.getByRole('button', { name: 'Send' }).click();
	await expect(tailor.getByLabel('Your message')).toHaveValue('');

	const arrived = customer.getByRole('log', { name: 'Messages' }).getByText(/Shall I use horn buttons\?/);
	await live(arrived).toBeVisible();
	const link = customer.getByRole('link', { name: 'https://example.com/buttons' }).last();
	await expect(link).toHaveAttribute('rel', 'noopener noreferrer nofollow');
	await expect(link).toHaveAttribute('target', '_blank');

	const answer = `Horn buttons would be lovely. ${Date.now()}`;
	await customer.getByLabel('Your message').fill(answer);
	await customer.getByLabel('Your message').press('Control+Enter');
	await live(tailor.getByRole('log', { name: 'Messages' }).getByText(answer)).toBeVisible();
	await customer.context().close();
	await tailor.context().close();
});
