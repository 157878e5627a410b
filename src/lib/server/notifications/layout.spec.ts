import { describe, expect, it } from 'vitest';
import { escapeHtml, isInternalPath, noticeMail } from './layout';

const base = {
	to: 'wenna@example.test',
	name: 'Wenna Polglase',
	title: 'A new quote for “Coat <b>& hat</b>”',
	body: 'First paragraph\nwith a second line.\n\nSecond <script>alert(1)</script> paragraph.',
	href: '/commissions/123',
	action: 'Compare quotes',
	required: null,
	origin: 'https://tackline.test'
} as const;

describe('the notice mail', () => {
	it('has a text part and an HTML part saying the same, each with the page and the preferences link', () => {
		const mail = noticeMail(base);
		expect(mail.subject).toBe(base.title);
		expect(mail.text).toBe(
			[
				'Hello Wenna,',
				'First paragraph\nwith a second line.\n\nSecond <script>alert(1)</script> paragraph.',
				'https://tackline.test/commissions/123',
				'— Tackline',
				'You can turn this kind of mail off. Choose which mails you get: https://tackline.test/account/notifications'
			].join('\n\n')
		);
		expect(mail.html).toContain(
			'<p style="margin:0 0 16px;font-size:16px;line-height:24px;color:#171923;">First paragraph<br>with a second line.</p>'
		);
		expect(mail.html).toContain('href="https://tackline.test/commissions/123"');
		expect(mail.html).toContain('href="https://tackline.test/account/notifications"');
		expect(mail.html).toContain('>Compare quotes</a>');
	});

	it('escapes everything it is given in the HTML part', () => {
		const html = noticeMail(base).html!;
		expect(html).not.toContain('<script>');
		expect(html).not.toContain('<b>');
		expect(html).toContain('Second &lt;script&gt;alert(1)&lt;/script&gt; paragraph.');
		expect(html).toContain('Coat &lt;b&gt;&amp; hat&lt;/b&gt;');
		expect(escapeHtml(`"'<>&`)).toBe('&quot;&#39;&lt;&gt;&amp;');
	});

	it('uses a font stack every mail program has, in the app’s colours', () => {
		const html = noticeMail(base).html!;
		expect(html).not.toMatch(/Poppins|@import|<link|<style/);
		expect(html).toContain('Arial, sans-serif');
		expect(html).toContain('#a93c25'); // madder-600, the app's primary button
		expect(html).toContain('#fcfaf6'); // linen-50, the page background
	});

	it('says why a required mail cannot be turned off', () => {
		expect(noticeMail({ ...base, required: 'money' }).text).toContain(
			'This mail is about money, so it is always sent.'
		);
		expect(noticeMail({ ...base, required: 'meeting' }).html).toContain('about meeting someone');
	});

	it('links only to paths inside Tackline', () => {
		for (const href of ['/orders/1', '/a?b=c#d', '/']) expect(isInternalPath(href), href).toBe(true);
		for (const href of [
			'//evil.test',
			'/\\evil.test',
			'https://evil.test',
			'javascript:alert(1)',
			'',
			'orders',
			'/a b',
			'/a\nb'
		])
			expect(isInternalPath(href), href).toBe(false);
		const outside = noticeMail({ ...base, href: '//evil.test/x' });
		expect(outside.text).not.toContain('evil.test');
		expect(outside.html).not.toContain('evil.test');
	});

	it('greets without a name when there is none', () => {
		expect(noticeMail({ ...base, name: null }).text.startsWith('Hello,\n\n')).toBe(true);
		expect(noticeMail({ ...base, name: '  ' }).text.startsWith('Hello,\n\n')).toBe(true);
	});
});
