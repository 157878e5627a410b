import { describe, expect, it } from 'vitest';
import { newClient } from './http';

const inbox = process.env.MAIL_INBOX_URL;

async function mailTo(address: string): Promise<{ subject: string; text: string }[]> {
	const response = await fetch(`${inbox}/messages?to=${encodeURIComponent(address)}`);
	return response.json();
}

describe('sign-in links', () => {
	it('mails a working one-time link to an existing account', async () => {
		const email = 'customer@tackline.test';
		const before = (await mailTo(email)).length;
		const response = await newClient().post('/sign-in?/magicLink', { email });
		expect(response.status).toBe(200);
		expect(await response.text()).toContain(email);

		const mails = await mailTo(email);
		expect(mails.length).toBe(before + 1);
		expect(mails[0].subject).toBe('Your Tackline sign-in link');
		const link = /https?:\/\/\S+/.exec(mails[0].text)?.[0];
		expect(link).toBeDefined();

		const client = newClient();
		const callback = await client.get(new URL(link!).pathname + new URL(link!).search);
		expect(callback.status).toBe(302);
		expect((await client.get('/commissions')).status).toBe(200);
		const reused = await newClient().get(new URL(link!).pathname + new URL(link!).search);
		expect(reused.headers.get('location')).toContain('error=Verification');
	});

	it('answers the same for an unknown address and sends nothing', async () => {
		const email = 'nobody-here@example.test';
		const response = await newClient().post('/sign-in?/magicLink', { email });
		expect(response.status).toBe(200);
		expect(await response.text()).toContain(email);
		expect(await mailTo(email)).toHaveLength(0);
	});
});
