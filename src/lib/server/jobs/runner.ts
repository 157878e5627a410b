import { discardQueueClient, queueClient } from '../services/queue';
import { queueDefinitions, type Workers } from './queues';

type RunnerState = 'stopped' | 'starting' | 'running' | 'stopping';
let state: RunnerState = 'stopped';
let retryTimer: ReturnType<typeof setTimeout> | null = null;
const RETRY_START_MS = 5_000;
const BATCH_SIZE = 10;

async function startOnce(workers: Workers) {
	const boss = queueClient();
	await boss.start();
	for (const queue of queueDefinitions()) {
		await boss.createQueue(queue.name, { name: queue.name, ...queue.options });
		await boss.updateQueue(queue.name, { name: queue.name, ...queue.options });
		const work = workers[queue.name] as ((data: unknown) => Promise<void>) | undefined;
		if (work) {
			// pg-boss fetches one batch per polling interval: take several jobs at once and run them side by
			// side, failing (for retry) only the ones that threw; the rest complete when the handler returns.
			await boss.work(queue.name, { batchSize: BATCH_SIZE, pollingIntervalSeconds: 1 }, async (jobs) => {
				const outcomes = await Promise.allSettled(jobs.map((job) => work(job.data)));
				for (const [i, outcome] of outcomes.entries()) {
					if (outcome.status === 'fulfilled') continue;
					const reason: unknown = outcome.reason;
					await boss.fail(queue.name, jobs[i].id, {
						message: reason instanceof Error ? reason.message : String(reason)
					});
				}
			});
		}
		if (queue.cron) await boss.schedule(queue.name, queue.cron.expression, queue.cron.data ?? {});
	}
}

/**
 * Starts pg-boss in this process: creates or updates every queue, then runs the workers, schedules and
 * maintenance. Jobs live in PostgreSQL, so none is lost across restarts. When the database is not
 * reachable yet, keeps trying in the background instead of failing the server's start.
 */
export async function startJobs(workers: Workers) {
	if (state !== 'stopped') return;
	state = 'starting';
	try {
		await startOnce(workers);
		state = 'running';
	} catch (error) {
		console.error(`[jobs] could not start, retrying: ${error instanceof Error ? error.message : String(error)}`);
		await discardQueueClient();
		state = 'stopped';
		retryTimer = setTimeout(() => void startJobs(workers), RETRY_START_MS);
		retryTimer.unref();
	}
}

/** Lets running jobs finish (up to ten seconds; unfinished ones are retried later) and closes the queue's pool. */
export async function stopJobs() {
	if (retryTimer) clearTimeout(retryTimer);
	if (state !== 'running') return;
	state = 'stopping';
	await queueClient().stop({ graceful: true, wait: true, timeout: 10_000 });
	state = 'stopped';
}

export function jobsRunning() {
	return state === 'running';
}
