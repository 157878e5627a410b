import type PgBoss from 'pg-boss';
import { mailRetry } from '../services/mailer';
import { moneyRetry } from '../services/order-settings';
import { queueNames, type QueueName } from './names';

export type QueueDefinition = {
	name: QueueName;
	/** Retries, back-off, expiry and dead letter, stored with the queue and applied to every job sent to it. */
	options: Omit<PgBoss.Queue, 'name'>;
	/** Recurring jobs: a cron expression (UTC) and the data each run gets. */
	cron?: { expression: string; data?: object };
};

/** Runs one job; a throw fails the attempt (retried per the queue's options). */
export type Worker = (data: never) => Promise<void>;

/**
 * The workers, by queue. The app's `init` hook passes them in, so the areas that queue jobs and the
 * areas that do them never import each other through this module.
 */
export type Workers = Partial<Record<QueueName, Worker>>;

/** The one place a queue is added. A dead-letter queue must come before the queues that use it. */
export function queueDefinitions(): QueueDefinition[] {
	const retry = mailRetry();
	const money = moneyRetry();
	// A call that moves money is retried until the processor answers, doubling the wait each time; every call
	// carries its action's idempotency key, so a retry of one that did go through changes nothing. One job per
	// order waits and one runs at a time (`stately` by the order's singleton key).
	const moneyOptions: Omit<PgBoss.Queue, 'name'> = {
		policy: 'stately',
		retryLimit: money.retryLimit,
		retryDelay: money.retryDelaySeconds,
		retryBackoff: true,
		expireInSeconds: 120
	};
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
			}
		},
		{
			name: queueNames.commissionExpiry,
			// One run at a time is enough: a run that finds nothing due is cheap, and a missed run's work is
			// picked up by the next (each commission expires in its own transaction, at most once).
			options: { policy: 'singleton', retryLimit: 3, retryDelay: 60, expireInSeconds: 300 },
			cron: { expression: '*/5 * * * *' }
		},
		{
			name: queueNames.quoteLapse,
			// As for expiry: one run at a time; each quote lapses in its own transaction, at most once.
			options: { policy: 'singleton', retryLimit: 3, retryDelay: 60, expireInSeconds: 300 },
			cron: { expression: '*/5 * * * *' }
		},
		{
			name: queueNames.messageDigest,
			// One run at a time; rows are locked while a run mails about them, and a missed minute is caught up.
			options: { policy: 'singleton', retryLimit: 2, retryDelay: 30, expireInSeconds: 120 },
			cron: { expression: '* * * * *' }
		},
		{
			name: queueNames.searchSync,
			// At most one run waiting and one running: every note asks for a run, and one run drains them all.
			// Retries back off while search is away; the minute cron starts again after the last retry.
			options: {
				policy: 'stately',
				retryLimit: 6,
				retryDelay: 5,
				retryBackoff: true,
				expireInSeconds: 300
			},
			cron: { expression: '* * * * *' }
		},
		{ name: queueNames.orderRelease, options: moneyOptions },
		{ name: queueNames.orderRefund, options: moneyOptions },
		{ name: queueNames.orderAdvance, options: moneyOptions },
		{
			name: queueNames.orderAutoRelease,
			// One run at a time; each order is released in its own transaction, at most once.
			options: { policy: 'singleton', retryLimit: 3, retryDelay: 60, expireInSeconds: 300 },
			cron: { expression: '*/5 * * * *' }
		}
	];
}
