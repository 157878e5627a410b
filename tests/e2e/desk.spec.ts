import { expect, test } from '@playwright/test';
import { signInWithPassword, signUp, uniqueEmail } from './helpers';

test.use({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.22' } });
// Two sign-ins and a sign-up hash passwords; give a busy machine room.
test.setTimeout(90_000);

test('the desk suspends with a reason, reinstates only after a confirmation, and keeps both in the history', async ({
	page,
	browser
}) => {
	const email = uniqueEmail('bending');
	const member = await browser.newPage({ extraHTTPHeaders: { 'x-forwarded-for': '198.19.0.23' } });
	await signUp(member, 'tailor', email, 'lantern ferries bend nine rules');
	await member.close();

	await signInWithPassword(page, 'admin@tackline.test', 'tackline-demo');
	await expect(page.getByRole('heading', { level: 1 })).toHaveText('Desk');
	await expect(page.getByRole('heading', { name: 'Disputes', exact: true })).toBeVisible();
	await page.getByRole('link', { name: 'People and suspensions' }).click();
	await page.getByLabel('Name or email').fill(email);
	await page.getByRole('button', { name: 'Search' }).click();

	const row = page.getByRole('listitem').filter({ hasText: email });
	await row.getByText('Suspend…').click();
	await row.getByLabel(/Why suspend/).fill('Asked customers to pay outside Tackline');
	await row.getByRole('button', { name: 'Suspend account' }).click();
	await expect(page.getByText('Account suspended.')).toBeVisible();
	await expect(row.getByText('suspended', { exact: true })).toBeVisible();

	await row.getByText('Reinstate…').click();
	await expect(row.getByText(/They can sign in again at once/)).toBeVisible();
	await expect(row.getByText('suspended', { exact: true })).toBeVisible();
	await row.getByRole('button', { name: 'Yes, reinstate' }).click();
	await expect(page.getByText('Account reinstated.')).toBeVisible();
	await expect(row.getByText('suspended', { exact: true })).toHaveCount(0);

	await row.getByText(/^History/).click();
	const history = row.getByRole('list');
	await expect(history.getByRole('listitem').nth(0)).toContainText('Reinstated by Aurélie Standish');
	await expect(history.getByRole('listitem').nth(1)).toContainText('Suspended by Aurélie Standish');
	await expect(history.getByRole('listitem').nth(1)).toContainText('Reason: Asked customers to pay outside Tackline');
	await expect(history.getByRole('listitem').nth(2)).toContainText('Joined by themselves');
});
