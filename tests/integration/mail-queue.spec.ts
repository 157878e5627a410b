import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { baseUrl, newClient, signIn, uniqueEmail } from './http';
import { mailTo, subjects, waitForMail } from './inbox';
import { closeMailDb, eventually, mailJobs, setRelay } from './mail';

afterEach(() => setRelay('up'));
afterAll(closeMailDb);

async function askForLink(email: string) {
	const response = await newClient().post('/sign-in?/magicLink', { email });
	expect(response.status).toBe(200);
	expect(await response.text()).toContain(email);
}

/** A link request for an address without an account: answered like any other, and mailed a note. */
async function notesTo(email: string) {
	return (await mailTo(email)).filter((m) => m.subject === subjects.noAccount);
}

/** The first attempt at the relay has failed and the job waits for its retry. */
async function firstAttemptFailed(email: string) {
	await eventually(async () => (await mailJobs(email)).some((job) => job.state === 'retry'));
}

describe('mail through the job queue', () => {
	it('answers at once while the relay is down, and delivers exactly once when it is back', async () => {
		const email = uniqueEmail('relay-down');
		await setRelay('down');
		await askForLink(email);
		await firstAttemptFailed(email);

		const health = await fetch(`${baseUrl}/api/v1/health`);
		expect(health.status).toBe(200);
		const text = await health.text();
		expect(JSON.parse(text)).toEqual({
			status: 'degraded',
			checks: { database: 'ok', mail: 'degraded', queue: 'ok', storage: 'ok', search: 'ok', payments: 'ok' }
		});
		expect(text).not.toMatch(/ECONN|127\.0\.0\.1|refused/i);

		await setRelay('up');
		await waitForMail(email, { subject: subjects.noAccount, timeoutMs: 25_000 });
		await eventually(async () => (await mailJobs(email)).every((job) => job.state === 'completed'));
		expect(await notesTo(email)).toHaveLength(1);
		expect(await mailJobs(email)).toHaveLength(1);
	}, 60_000);

	it('answers at once while the relay accepts connections but never speaks', async () => {
		const email = uniqueEmail('relay-stalled');
		await setRelay('stalled');
		await askForLink(email);
		expect((await fetch(`${baseUrl}/api/v1/health`)).status).toBe(200);
		await firstAttemptFailed(email);

		await setRelay('up');
		await waitForMail(email, { subject: subjects.noAccount, timeoutMs: 25_000 });
		await eventually(async () => (await mailJobs(email)).every((job) => job.state === 'completed'));
		expect(await notesTo(email)).toHaveLength(1);
	}, 60_000);

	it('keeps mail that failed every retry on the desk, to send again or discard', async () => {
		const [kept, dropped] = [uniqueEmail('dead-letter-kept'), uniqueEmail('dead-letter-dropped')];
		await setRelay('down');
		await askForLink(kept);
		await askForLink(dropped);
		for (const email of [kept, dropped]) {
			await eventually(async () => (await mailJobs(email, 'mail-dead-letter')).length === 1, 45_000);
		}
		await setRelay('up');

		const customer = newClient();
		await signIn(customer, 'customer@tackline.test', 'tackline-demo');
		expect((await customer.get('/desk/mail')).status).toBe(403);

		const admin = newClient();
		expect((await signIn(admin, 'admin@tackline.test', 'tackline-demo')).status).toBe(303);
		const page = await (await admin.get('/desk/mail')).text();
		expect(page).toContain(kept);
		expect(page).toContain('Last error');
		const [keptJob] = await mailJobs(kept, 'mail-dead-letter');
		const [droppedJob] = await mailJobs(dropped, 'mail-dead-letter');
		expect(page).toContain(keptJob.id);

		expect((await admin.post('/desk/mail?/resend', { id: keptJob.id })).status).toBe(200);
		expect((await admin.post('/desk/mail?/discard', { id: droppedJob.id })).status).toBe(200);
		expect((await admin.post('/desk/mail?/discard', { id: droppedJob.id })).status).toBe(404);
		expect((await admin.post('/desk/mail?/resend', { id: 'not-an-id' })).status).toBe(400);

		await waitForMail(kept, { subject: subjects.noAccount, timeoutMs: 25_000 });
		expect(await notesTo(kept)).toHaveLength(1);
		const after = await (await admin.get('/desk/mail')).text();
		expect(after).not.toContain(kept);
		expect(after).not.toContain(dropped);
		expect(await mailJobs(dropped, 'mail-dead-letter')).toHaveLength(0);
		expect((await mailJobs(dropped)).every((job) => job.state === 'failed')).toBe(true);
	}, 90_000);
});
