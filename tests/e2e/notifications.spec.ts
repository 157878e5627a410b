import { expect, test } from '@playwright/test';
import { createDb } from '../../src/lib/server/db/client';
import { notification } from '../../src/lib/server/db/schema';
import { createUser } from '../factories';
import { signInWithPassword } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.117' } });
// Signing in hashes a password; give a busy machine room.
test.setTimeout(90_000);

/** A customer with two unread notices, made straight in the browser tests' database. */
async function customerWithNotices() {
	const { db, pool } = createDb(process.env.DATABASE_URL!, { max: 1 });
	try {
		const customer = await createUser(db, { name: 'Elowen Trethewey' });
		await db.insert(notification).values([
			{
				userId: customer.id,
				event: 'quote_received',
				title: 'A new quote for “Linen waistcoat”',
				body: 'Compare it with the others.',
				href: '/commissions'
			},
			{
				userId: customer.id,
				event: 'progress_posted',
				title: 'Your coat is cut',
				body: 'The pieces are cut and marked.',
				href: '/account'
			}
		]);
		return customer;
	} finally {
		await pool.end();
	}
}

test('the bell counts unread notices; opening one follows it, and the settings grid saves', async ({ page }) => {
	const customer = await customerWithNotices();
	await signInWithPassword(page, customer.email, customer.password);

	const bell = page.getByRole('banner').getByRole('link', { name: 'Notifications, 2 unread' }).first();
	await expect(bell).toBeVisible();
	await bell.click();
	await expect(page.getByRole('heading', { name: 'Notifications', level: 1 })).toBeVisible();
	await expect(page.getByRole('status').getByText('2 unread notices.')).toBeVisible();

	await page.getByRole('button', { name: 'Mark read: Your coat is cut' }).click();
	await expect(page.getByRole('status').getByText('1 unread notice.')).toBeVisible();
	await expect(page.getByRole('banner').getByRole('link', { name: 'Notifications, 1 unread' }).first()).toBeAttached();

	await page.getByRole('button', { name: 'Unread: A new quote for “Linen waistcoat”' }).click();
	await expect(page).toHaveURL(/\/commissions$/);
	await expect(
		page.getByRole('banner').getByRole('link', { name: 'Notifications', exact: true }).first()
	).toBeAttached();

	await page.goto('/account/notifications');
	const quoteMail = page.getByRole('checkbox', { name: 'A quote arrives: Mail' });
	await expect(quoteMail).toBeChecked();
	await expect(page.getByRole('checkbox', { name: 'Payment received: Mail' })).toBeDisabled();
	await quoteMail.uncheck();
	await page.getByRole('button', { name: 'Save settings' }).click();
	await expect(page.getByText('Your notification settings are saved.')).toBeVisible();
	await expect(quoteMail).not.toBeChecked();
	await page.reload();
	await expect(page.getByRole('checkbox', { name: 'A quote arrives: Mail' })).not.toBeChecked();
	await expect(page.getByRole('checkbox', { name: 'A quote arrives: In Tackline' })).toBeChecked();
});
