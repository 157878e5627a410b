import { describe, expect, it } from 'vitest';
import { newClient, openLink } from './http';
import { linkIn, mailTo, subjects, waitForMail } from './inbox';

describe('sign-in links', () => {
	it('mails a working one-time link to an existing account, stating its lifetime', async () => {
		const email = 'customer@tackline.test';
		const before = (await mailTo(email)).filter((m) => m.subject === subjects.signInLink).length;
		const response = await newClient().post('/sign-in?/magicLink', { email });
		expect(response.status).toBe(200);
		const page = await response.text();
		expect(page).toContain(email);
		expect(page).toContain('expires in 15 minutes');

		const mail = await waitForMail(email, { subject: subjects.signInLink, count: before + 1 });
		expect(mail.text).toContain('expires in 15 minutes');
		const link = linkIn(mail);

		const client = newClient();
		const callback = await openLink(client, link);
		expect(callback.status).toBe(302);
		expect((await client.get('/commissions')).status).toBe(200);
		const reused = await openLink(newClient(), link);
		expect(reused.headers.get('location')).toContain('error=Verification');
	});

	it('answers the same for an unknown address and mails it a note without a link', async () => {
		const email = 'nobody-here@example.test';
		const response = await newClient().post('/sign-in?/magicLink', { email });
		expect(response.status).toBe(200);
		expect(await response.text()).toContain(email);
		const note = await waitForMail(email, { subject: subjects.noAccount });
		expect(note.text).not.toMatch(/\/auth\/callback/);
	});
});
