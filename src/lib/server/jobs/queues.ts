import type PgBoss from 'pg-boss';
import * as mail from '../mail';
import { mailRetry } from '../services/mailer';
import { queueNames, type QueueName } from './names';

export type QueueDefinition = {
	name: QueueName;
	/** Retries, back-off, expiry and dead letter, stored with the queue and applied to every job sent to it. */
	options: Omit<PgBoss.Queue, 'name'>;
	/** Runs one job; a throw fails the attempt (retried per `options`). Omit for a queue nobody works. */
	work?: (data: never) => Promise<void>;
	/** Recurring jobs: a cron expression (UTC) and the data each run gets. */
	cron?: { expression: string; data?: object };
};

/** The one place a queue is added. A dead-letter queue must come before the queues that use it. */
export function queueDefinitions(): QueueDefinition[] {
	const retry = mailRetry();
	return [
		{ name: queueNames.mailDeadLetter, options: { policy: 'standard' } },
		{
			name: queueNames.mail,
			options: {
				policy: 'standard',
				retryLimit: retry.retryLimit,
				retryDelay: retry.retryDelaySeconds,
				retryBackoff: true,
				// A send is bounded by the transport's timeouts; an attempt still active after this was lost
				// with its process and is retried.
				expireInSeconds: 120,
				deadLetter: queueNames.mailDeadLetter
			},
			work: mail.deliver
		}
	];
}
