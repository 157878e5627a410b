/** Starts every local stand-in for a hosted service and returns the environment the app needs. */
import { startMailStandin } from './mail';

export type StandinPorts = { smtp: number; mailApi: number };

export async function startStandins(ports: StandinPorts) {
	const mail = await startMailStandin({ smtpPort: ports.smtp, apiPort: ports.mailApi });
	return {
		env: {
			SMTP_URL: mail.smtpUrl,
			MAIL_INBOX_URL: mail.inboxUrl,
			MAIL_FROM: 'Tackline <hello@tackline.test>'
		},
		async stop() {
			await mail.stop();
		}
	};
}
