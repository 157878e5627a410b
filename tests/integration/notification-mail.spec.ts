// Notices while the mail relay is down: the changes that cause them answer at once, the in-app notices are there
// straight away, and every mail arrives exactly once when the relay is back. Runs in the serial project because
// it stops the shared mail stand-in.
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { createCommission, createUser } from '../factories';
import { createQuotingWorkroom } from '../factories/quotes';
import { testDb } from './db';
import { callJson, signedIn } from './http';
import { mailTo, waitForMail } from './inbox';
import { closeMailDb, eventually, mailJobs, setRelay } from './mail';

const { db, pool } = testDb();
afterEach(() => setRelay('up'));
afterAll(async () => {
	await closeMailDb();
	await pool.end();
});

const day = 86_400_000;
const later = (days: number) => new Date(Date.now() + days * day).toISOString().slice(0, 10);

describe('notices while the mail relay is down', () => {
	it('keeps every mail and delivers each exactly once when the relay is back', async () => {
		const customer = await createUser(db, { name: 'Talwyn Hosking' });
		const title = `Wool coat ${Math.random().toString(36).slice(2, 8)}`;
		const commission = await createCommission(db, {
			customerId: customer.id,
			title,
			dateNeeded: later(60),
			expiresAt: new Date(Date.now() + 20 * day)
		});
		const tailors = await Promise.all([0, 1, 2].map(() => createQuotingWorkroom(db)));
		// Sign everyone in first: only the notices should meet the missing relay.
		const tailorClients = await Promise.all(tailors.map((tailor) => signedIn(tailor)));
		const customerClient = await signedIn(customer);

		await setRelay('down');
		const quoteIds: string[] = [];
		for (const client of tailorClients) {
			const sent = await callJson(client, 'POST', `/api/v1/commissions/${commission.id}/quotes`, {
				priceMinor: 42000,
				currency: 'EUR',
				deliveryDate: later(40),
				fittings: 2,
				fabricIncluded: false,
				message: '',
				validUntil: later(10)
			});
			expect(sent.status).toBe(201);
			quoteIds.push(sent.body.id as string);
		}
		const declined = await callJson(customerClient, 'POST', `/api/v1/quotes/${quoteIds[0]}/decline`, {
			reason: 'Too warm for our winters.'
		});
		expect(declined.status).toBe(200);

		// The in-app notices do not wait for the relay.
		const inApp = await callJson(customerClient, 'GET', '/api/v1/notifications');
		expect(inApp.body.items).toHaveLength(3);
		expect(inApp.body.unreadCount).toBe(3);

		await eventually(async () => {
			const jobs = [...(await mailJobs(customer.email)), ...(await mailJobs(tailors[0].email))];
			return jobs.length === 4 && jobs.every((job) => job.state === 'retry');
		});
		expect(await mailTo(customer.email)).toHaveLength(0);

		await setRelay('up');
		const subjects = tailors.map((tailor) => `A new quote for “${title}” from ${tailor.shopName}`);
		for (const subject of subjects) await waitForMail(customer.email, { subject, timeoutMs: 25_000 });
		await waitForMail(tailors[0].email, { subject: `Your quote for “${title}” was declined`, timeoutMs: 25_000 });
		await eventually(async () => {
			const jobs = [...(await mailJobs(customer.email)), ...(await mailJobs(tailors[0].email))];
			return jobs.every((job) => job.state === 'completed');
		});

		const received = await mailTo(customer.email);
		expect(received.map((mail) => mail.subject).sort()).toEqual([...subjects].sort());
		expect(await mailTo(tailors[0].email)).toHaveLength(1);
		expect(await mailJobs(customer.email)).toHaveLength(3);
		for (const tailor of tailors.slice(1)) expect(await mailTo(tailor.email)).toHaveLength(0);
	}, 90_000);
});
