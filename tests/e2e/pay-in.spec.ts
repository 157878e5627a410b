import { expect, test } from '@playwright/test';
import { createDb } from '../../src/lib/server/db/client';
import { createCommission, createUser, createWorkroom } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { signInWithPassword } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.93' } });
// Signing in hashes a password; give a busy machine room.
test.setTimeout(120_000);
const after = expect.configure({ timeout: 30_000 });

/** A customer whose accepted quote (€312.40) waits for payment, made straight in the browser tests' database. */
async function unpaidOrder() {
	const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 1 });
	try {
		const customer = await createUser(db, { name: 'Loveday Penhale' });
		const tailor = await createWorkroom(db);
		const made = await createCommission(db, { customerId: customer.id, status: 'open' });
		const q = await insertQuote(db, { commissionId: made.id, tailorId: tailor.id, priceMinor: 31_240 });
		const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
		return { customer, orderId };
	} finally {
		await pool.end();
	}
}

test('the customer pays on the hosted page: a declined card shows its message, a good one pays', async ({ page }) => {
	const { customer, orderId } = await unpaidOrder();
	await signInWithPassword(page, customer.email, customer.password);
	await page.goto(`/orders/${orderId}/paid`);
	await expect(page.getByRole('heading', { name: 'Payment', level: 1 })).toBeVisible();

	await page.getByRole('button', { name: 'Pay now · €312.40' }).click();
	// The processor's page, on its own origin (allowed by the form-action policy).
	await after(page.getByRole('button', { name: /^Pay / })).toBeVisible();
	expect(new URL(page.url()).pathname).toMatch(/^\/c\/pay\/cs_/);

	await page.getByLabel('Card number').fill('4000 0000 0000 0002');
	await page.getByRole('button', { name: /^Pay / }).click();
	await after(page.getByText(/declined/i).first()).toBeVisible();

	// Back to Tackline without paying: the order is unpaid, the card's message is there, and it can be retried.
	await page.getByRole('link', { name: 'Cancel and go back' }).click();
	await after(page.getByText('Nothing was charged')).toBeVisible();
	await expect(page.getByText('Your last card attempt did not go through')).toBeVisible();
	await expect(page.getByText(/declined/i).first()).toBeVisible();

	await page.getByRole('button', { name: 'Try again · €312.40' }).click();
	await after(page.getByLabel('Card number')).toBeVisible();
	await page.getByLabel('Card number').fill('4242 4242 4242 4242');
	await page.getByRole('button', { name: /^Pay / }).click();

	await after(page.getByText('Paid — thank you')).toBeVisible();
	expect(new URL(page.url()).pathname).toBe(`/orders/${orderId}/paid`);
	await expect(page.getByRole('heading', { name: 'Payment received', level: 1 })).toBeVisible();
	await expect(page.getByRole('button', { name: /Pay now|Try again/ })).toHaveCount(0);
});
