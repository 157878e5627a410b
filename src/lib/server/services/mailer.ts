import { env } from '$env/dynamic/private';
import nodemailer, { type Transporter } from 'nodemailer';
import SMTPTransport from 'nodemailer/lib/smtp-transport/index.js';

let transporter: Transporter | null = null;

/**
 * The configured SMTP transport: a real relay in production, the local stand-in elsewhere. Short
 * timeouts, so a relay that accepts connections but never answers cannot hold a mail worker.
 */
export function mailer(): Transporter {
	if (!env.SMTP_URL) throw new Error('SMTP_URL is not set');
	// Built as a transport object: `createTransport(url, …)` would drop every option but the URL.
	transporter ??= nodemailer.createTransport(
		new SMTPTransport({
			url: env.SMTP_URL,
			// The local stand-in speaks plain SMTP on loopback; real relays use smtps:// or STARTTLS.
			ignoreTLS: env.SMTP_URL.startsWith('smtp://127.0.0.1') || env.SMTP_URL.startsWith('smtp://localhost'),
			connectionTimeout: 5_000,
			greetingTimeout: 5_000,
			socketTimeout: 15_000,
			dnsTimeout: 5_000
		})
	);
	return transporter;
}

export function mailFrom() {
	return env.MAIL_FROM ?? 'Tackline <hello@tackline.test>';
}

function positiveInteger(value: string | undefined, fallback: number) {
	const parsed = Number(value);
	return Number.isInteger(parsed) && parsed > 0 ? parsed : fallback;
}

/**
 * How often a mail is retried before it lands on the desk's dead-letter list. The delay doubles each
 * time (with jitter): 10 s, 20 s, 40 s … about an hour in all by default. Tests shorten both.
 */
export function mailRetry() {
	return {
		retryLimit: positiveInteger(env.MAIL_RETRY_LIMIT, 8),
		retryDelaySeconds: positiveInteger(env.MAIL_RETRY_DELAY_SECONDS, 10)
	};
}
