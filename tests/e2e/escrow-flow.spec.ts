import { expect, test, type Browser, type Page } from '@playwright/test';
import { eq } from 'drizzle-orm';
import { createDb } from '../../src/lib/server/db/client';
import { user } from '../../src/lib/server/db/schema';
import { createCommission, createUser } from '../factories';
import { awardQuote, insertQuote } from '../factories/quotes';
import { signInWithPassword } from './helpers';

// Signing in hashes a password, the processor's webhook and the release job run in the background: give a busy
// machine room.
test.setTimeout(300_000);
const soon = expect.configure({ timeout: 30_000 });

const inDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

/**
 * A fresh customer's accepted quote (€240) with the demo tailor, whose payouts the seed set up at the
 * processor stand-in, made straight in the browser tests' database.
 */
async function unpaidOrder() {
	const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 1 });
	try {
		const customer = await createUser(db, { name: 'Kerensa Pascoe' });
		const [tailor] = await db.select({ id: user.id }).from(user).where(eq(user.email, 'tailor@tackline.test'));
		const title = `Moss green linen waistcoat ${Date.now()}`;
		const made = await createCommission(db, { customerId: customer.id, status: 'open', title });
		const q = await insertQuote(db, {
			commissionId: made.id,
			tailorId: tailor.id,
			priceMinor: 24_000,
			deliveryDate: inDays(40)
		});
		const { orderId } = await awardQuote(db, { commissionId: made.id, quoteId: q.id, customerId: customer.id });
		return { customer, orderId, title };
	} finally {
		await pool.end();
	}
}

async function signedInPage(browser: Browser, email: string, password: string, address: string) {
	const context = await browser.newContext({
		viewport: { width: 1280, height: 900 },
		extraHTTPHeaders: { 'x-forwarded-for': address }
	});
	const page = await context.newPage();
	await signInWithPassword(page, email, password);
	return page;
}

/** Reloads the order page until its status says `words` (the webhook and the release job run in the background). */
async function waitForStatus(page: Page, orderId: string, words: RegExp) {
	await soon(async () => {
		await page.goto(`/orders/${orderId}`);
		await expect(page.getByTestId('order-status')).toHaveText(words, { timeout: 2000 });
	}).toPass({ timeout: 60_000 });
}

test('pay, follow the work, book a fitting, deliver, confirm: both see the payment released', async ({ browser }) => {
	const { customer, orderId, title } = await unpaidOrder();
	const buyer = await signedInPage(browser, customer.email, customer.password, '198.19.11.31');
	const tailor = await signedInPage(browser, 'tailor@tackline.test', 'tackline-demo', '198.19.11.32');

	// The customer finds the order and pays; a declined card first shows its message and charges nothing.
	await buyer.goto('/orders');
	await buyer.getByRole('link', { name: title }).click();
	await expect(buyer.getByRole('heading', { level: 1, name: title })).toBeVisible();
	await expect(buyer.getByTestId('order-status')).toHaveText('Awaiting payment');
	await buyer.getByRole('button', { name: 'Pay now · €240' }).click();
	await soon(buyer.getByLabel('Card number')).toBeVisible();
	await buyer.getByLabel('Card number').fill('4000 0000 0000 0002');
	await buyer.getByRole('button', { name: /^Pay / }).click();
	await soon(buyer.getByText(/declined/i).first()).toBeVisible();
	await buyer.getByRole('link', { name: 'Cancel and go back' }).click();
	await soon(buyer.getByText('Nothing was charged')).toBeVisible();
	await buyer.goto(`/orders/${orderId}`);
	await expect(buyer.getByText('The last card attempt did not go through')).toBeVisible();
	await expect(buyer.getByText(/declined/i).first()).toBeVisible();

	await buyer.getByRole('button', { name: 'Try again · €240' }).click();
	await soon(buyer.getByLabel('Card number')).toBeVisible();
	await buyer.getByLabel('Card number').fill('4242 4242 4242 4242');
	await buyer.getByRole('button', { name: /^Pay / }).click();
	await soon(buyer.getByText('Paid — thank you')).toBeVisible();
	await waitForStatus(buyer, orderId, /Paid — held by Tackline/);

	// The tailor posts progress from the order page.
	await tailor.goto(`/orders/${orderId}`);
	await expect(tailor.getByTestId('order-status')).toHaveText(/Paid — held by Tackline/);
	await tailor.getByLabel('Step', { exact: true }).selectOption({ label: 'Cut' });
	await tailor.getByLabel(/Note for the customer/).fill('Cut from the moss linen; pockets next.');
	await tailor.getByRole('button', { name: 'Post this step' }).click();
	await soon(tailor.getByTestId('timeline')).toContainText('Cut from the moss linen; pockets next.');
	await expect(tailor.getByTestId('order-status')).toHaveText(/In work/);

	// The tailor offers a fitting; the customer sees the step and books the time.
	await tailor.getByRole('link', { name: 'Offer times and see all fittings' }).click();
	await soon(tailor.getByLabel('Day 1')).toBeVisible();
	await tailor.getByLabel('Day 1').fill(inDays(6));
	await tailor.getByLabel('Start 1').fill('10:30');
	await tailor.getByRole('button', { name: 'Offer these times' }).click();
	await soon(
		tailor.getByRole('button', { name: 'Mark as done' }).or(tailor.getByText(/offered/i).first())
	).toBeVisible();

	await buyer.goto(`/orders/${orderId}`);
	await expect(buyer.getByTestId('timeline')).toContainText('Cut from the moss linen; pockets next.');
	await buyer.getByRole('link', { name: 'See all fittings' }).click();
	await buyer.getByRole('button', { name: 'Book this time' }).first().click();
	await soon(buyer.getByRole('status').filter({ hasText: 'Booked. The calendar file' })).toBeVisible();
	await buyer.goto(`/orders/${orderId}`);
	await expect(buyer.getByRole('region', { name: 'Fittings' })).toContainText('Next fitting');

	// The tailor hands it over at the workroom.
	await tailor.goto(`/orders/${orderId}`);
	await tailor.getByLabel('Picked up at the workroom').check();
	await tailor.getByLabel(/^Note \(pickup address/).fill('Collected at the workroom on Fore Street.');
	await tailor.getByRole('button', { name: 'Mark delivered' }).click();
	await soon(tailor.getByText('Marked delivered. The customer has been told.')).toBeVisible();

	// The customer confirms, after saying yes once more; the release job pays the workroom.
	await buyer.goto(`/orders/${orderId}`);
	await expect(buyer.getByTestId('order-status')).toHaveText(/Delivered — held by Tackline until you confirm/);
	await expect(buyer.getByRole('region', { name: 'Delivery' })).toContainText('Pickup at');
	await buyer.getByRole('link', { name: 'Confirm delivery…' }).click();
	await expect(buyer.getByText('Confirm delivery and pay the workroom?')).toBeVisible();
	await buyer.getByRole('button', { name: 'Yes, confirm and release the payment' }).click();
	await soon(buyer.getByText(/delivery confirmed/i).first()).toBeVisible();

	await waitForStatus(buyer, orderId, /Released — the workroom has been paid/);
	await expect(buyer.getByTestId('ledger')).toContainText('Released to the workroom');
	await waitForStatus(tailor, orderId, /Released — the workroom has been paid/);
	await expect(tailor.getByTestId('timeline')).toContainText('Payment released to the workroom');

	// The page fits a small phone without sideways scrolling.
	await buyer.setViewportSize({ width: 360, height: 740 });
	await buyer.goto(`/orders/${orderId}`);
	const overflow = await buyer.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
	expect(overflow).toBeLessThanOrEqual(0);
});
