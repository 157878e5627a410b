import type { Mail, MailAttachment } from '../mail';
import type { Required } from './catalogue';

/**
 * Tackline's look in mail: the app's linen, ink and madder (tailwind.config.js), a font stack every mail
 * program already has (no web font), one column no wider than 600 px, and inline styles only, since many
 * mail programs drop `<style>` blocks.
 */
const palette = {
	linen50: '#fcfaf6',
	linen200: '#ede4d3',
	ink900: '#171923',
	ink700: '#343845',
	ink500: '#5d6170',
	madder600: '#a93c25',
	madder700: '#8a3120',
	woad700: '#24495a'
};
const fontStack = "-apple-system, BlinkMacSystemFont, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif";

export const preferencesPath = '/account/notifications';

/** What a notice mail is made of; `body` is plain text with paragraphs separated by a blank line. */
export type NoticeMail = {
	to: string;
	name: string | null;
	title: string;
	body: string;
	/** A path inside Tackline, or null for a mail without a single page to open. */
	href: string | null;
	action: string;
	required: Required;
	origin: string;
	attachments?: MailAttachment[];
};

/** Escapes text for HTML element content and double-quoted attributes. */
export function escapeHtml(value: string) {
	return value
		.replaceAll('&', '&amp;')
		.replaceAll('<', '&lt;')
		.replaceAll('>', '&gt;')
		.replaceAll('"', '&quot;')
		.replaceAll("'", '&#39;');
}

/** A path inside Tackline: one leading slash, no scheme, no `//` or `/\` that a browser would read as another host. */
export function isInternalPath(href: string) {
	return /^\/(?![/\\])/.test(href) && !/[\s\\\p{Cc}]/u.test(href);
}

function greeting(name: string | null) {
	const first = name?.trim().split(/\s+/)[0];
	return `Hello${first ? ` ${first}` : ''},`;
}

function why(required: Required) {
	if (required === 'money') return 'This mail is about money, so it is always sent.';
	if (required === 'meeting') return 'This mail is about meeting someone, so it is always sent.';
	return 'You can turn this kind of mail off.';
}

function paragraphs(body: string) {
	return body
		.trim()
		.split(/\n{2,}/)
		.map((paragraph) => paragraph.split('\n').map(escapeHtml).join('<br>'));
}

function html(notice: NoticeMail, link: string | null, preferences: string) {
	const p = `margin:0 0 16px;font-size:16px;line-height:24px;color:${palette.ink900};`;
	const body = paragraphs(notice.body)
		.map((paragraph) => `<p style="${p}">${paragraph}</p>`)
		.join('\n');
	const button = link
		? `<table role="presentation" cellpadding="0" cellspacing="0" border="0" style="margin:8px 0 24px;"><tr><td style="border-radius:8px;background:${palette.madder600};"><a href="${escapeHtml(link)}" style="display:inline-block;padding:12px 20px;font-family:${fontStack};font-size:16px;font-weight:600;color:#ffffff;text-decoration:none;border-radius:8px;">${escapeHtml(notice.action)}</a></td></tr></table>
<p style="margin:0 0 16px;font-size:13px;line-height:20px;color:${palette.ink500};">Or paste this address into your browser: <span style="color:${palette.ink700};word-break:break-all;">${escapeHtml(link)}</span></p>`
		: '';
	return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="light">
<title>${escapeHtml(notice.title)}</title>
</head>
<body style="margin:0;padding:0;background:${palette.linen50};font-family:${fontStack};">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="background:${palette.linen50};">
<tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="max-width:600px;">
<tr><td style="padding:0 8px 16px;font-family:${fontStack};font-size:20px;font-weight:700;letter-spacing:0.02em;color:${palette.madder700};">Tackline</td></tr>
<tr><td style="background:#ffffff;border:1px solid ${palette.linen200};border-radius:14px;padding:28px 24px;font-family:${fontStack};">
<h1 style="margin:0 0 20px;font-size:22px;line-height:30px;font-weight:700;color:${palette.ink900};">${escapeHtml(notice.title)}</h1>
<p style="${p}">${escapeHtml(greeting(notice.name))}</p>
${body}
${button}
<p style="margin:0;font-size:16px;line-height:24px;color:${palette.ink700};">— Tackline</p>
</td></tr>
<tr><td style="padding:16px 8px;font-family:${fontStack};font-size:13px;line-height:20px;color:${palette.ink500};">
${escapeHtml(why(notice.required))} <a href="${escapeHtml(preferences)}" style="color:${palette.woad700};">Choose which mails you get</a>.<br>
Tackline, made-to-measure clothes from tailors near you.
</td></tr>
</table>
</td></tr>
</table>
</body>
</html>`;
}

/** A notice as a mail with a plain-text part and an HTML part saying the same, each ending with the preferences link. */
export function noticeMail(notice: NoticeMail): Mail {
	const link = notice.href && isInternalPath(notice.href) ? `${notice.origin}${notice.href}` : null;
	const preferences = `${notice.origin}${preferencesPath}`;
	const text = [
		greeting(notice.name),
		notice.body.trim(),
		...(link ? [link] : []),
		'— Tackline',
		`${why(notice.required)} Choose which mails you get: ${preferences}`
	].join('\n\n');
	return {
		to: notice.to,
		subject: notice.title,
		text,
		html: html(notice, link, preferences),
		...(notice.attachments?.length ? { attachments: notice.attachments } : {})
	};
}
