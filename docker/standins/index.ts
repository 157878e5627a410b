/** Starts every local stand-in for a hosted service and returns the environment the app needs. */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startMailStandin } from './mail';
import { startS3Standin } from './s3';
import { startSearchStandin } from './search';

/** `s3` and `search` 0 (the default) pick a free port. */
export type StandinPorts = { smtp: number; mailApi: number; s3?: number; search?: number };

/** Without `s3DataDir`, stored objects go to a throwaway folder removed on stop. */
export async function startStandins(ports: StandinPorts, options: { s3DataDir?: string } = {}) {
	const mail = await startMailStandin({ smtpPort: ports.smtp, apiPort: ports.mailApi });
	const throwaway = options.s3DataDir ? null : mkdtempSync(join(tmpdir(), 'tackline-s3-'));
	const s3 = await startS3Standin({
		port: ports.s3 ?? 0,
		dataDir: options.s3DataDir ?? (throwaway as string),
		bucket: 'tackline-photos'
	});
	const search = await startSearchStandin({ port: ports.search ?? 0 });
	return {
		search,
		env: {
			SMTP_URL: mail.smtpUrl,
			MAIL_INBOX_URL: mail.inboxUrl,
			MAIL_FROM: 'Tackline <hello@tackline.test>',
			...s3.env,
			...search.env,
			AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true'
		},
		async stop() {
			await Promise.all([mail.stop(), s3.stop(), search.stop()]);
			if (throwaway) rmSync(throwaway, { recursive: true, force: true });
		}
	};
}
