/** Starts every local stand-in for a hosted service and returns the environment the app needs. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startMailStandin } from './mail';
import { startS3Standin } from './s3';
import { startSearchStandin } from './search';
import { startStripeStandin } from './stripe';

/** `s3`, `search` and `stripe` 0 (the default) pick a free port. */
export type StandinPorts = { smtp: number; mailApi: number; s3?: number; search?: number; stripe?: number };

export type StandinOptions = {
	/** Without it, stored objects go to a throwaway folder removed on stop. */
	s3DataDir?: string;
	/** Stripe's state survives restarts in this file; without it, it lives in memory only. */
	stripeStateFile?: string;
	/** The app's webhook endpoint; may also be set later with `stripe.setWebhookUrl`. */
	stripeWebhookUrl?: string;
	stripeWebhookSecret?: string;
	stripeSecretKey?: string;
};

export async function startStandins(ports: StandinPorts, options: StandinOptions = {}) {
	const mail = await startMailStandin({ smtpPort: ports.smtp, apiPort: ports.mailApi });
	const throwaway = options.s3DataDir ? null : mkdtempSync(join(tmpdir(), 'tackline-s3-'));
	const s3 = await startS3Standin({
		port: ports.s3 ?? 0,
		dataDir: options.s3DataDir ?? (throwaway as string),
		bucket: 'tackline-photos'
	});
	const search = await startSearchStandin({ port: ports.search ?? 0 });
	const stripe = await startStripeStandin({
		port: ports.stripe ?? 0,
		secretKey: options.stripeSecretKey,
		webhookSecret: options.stripeWebhookSecret,
		stateFile: options.stripeStateFile
	});
	if (options.stripeWebhookUrl) stripe.setWebhookUrl(options.stripeWebhookUrl);
	return {
		search,
		stripe,
		env: {
			SMTP_URL: mail.smtpUrl,
			MAIL_INBOX_URL: mail.inboxUrl,
			MAIL_FROM: 'Tackline <hello@tackline.test>',
			...s3.env,
			...search.env,
			...stripe.env,
			AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true'
		},
		async stop() {
			await Promise.all([mail.stop(), s3.stop(), search.stop(), stripe.stop()]);
			if (throwaway) rmSync(throwaway, { recursive: true, force: true });
		}
	};
}
