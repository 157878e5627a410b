import { env } from '$env/dynamic/private';
import nodemailer, { type Transporter } from 'nodemailer';

let transporter: Transporter | null = null;

/** The configured SMTP transport: a real relay in production, the local stand-in elsewhere. */
export function mailer(): Transporter {
	if (!env.SMTP_URL) throw new Error('SMTP_URL is not set');
	transporter ??= nodemailer.createTransport(env.SMTP_URL, {
		// The local stand-in speaks plain SMTP on loopback; real relays use smtps:// or STARTTLS.
		ignoreTLS: env.SMTP_URL.startsWith('smtp://127.0.0.1') || env.SMTP_URL.startsWith('smtp://localhost')
	});
	return transporter;
}

export function mailFrom() {
	return env.MAIL_FROM ?? 'Tackline <hello@tackline.test>';
}
