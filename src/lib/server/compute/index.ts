import { availableParallelism } from 'node:os';
import Piscina from 'piscina';
import type { Task, TaskResult } from './tasks';

/** The computation took longer than its budget: the worker running it was stopped. */
export class OverBudget extends Error {}
/** Every worker is busy and the queue is full. */
export class Busy extends Error {}

/** Generous for any real garment (a full draft takes milliseconds); only pathological input gets near it. */
export const defaultBudgetMs = 5000;

type Pool = Piscina<Task, TaskResult[Task['kind']]>;
let pool: Pool | null = null;
let ready: Promise<Pool> | null = null;

/** The pool, with one worker started and loaded, so a budget measures work and not start-up. */
function openPool(): Promise<Pool> {
	ready ??= startPool().catch((error) => {
		ready = null;
		throw error;
	});
	return ready;
}

async function startPool(): Promise<Pool> {
	// A dynamic import keeps the worker module in a chunk of its own in the server build, and its
	// import.meta.url says where that chunk is. Under Vite (dev, tests) it is the .ts source, run through tsx.
	const worker = await import('./worker');
	// Referencing the default export here also keeps the bundler from shaking it out of the chunk.
	if (typeof worker.default !== 'function') throw new Error('The compute worker module exports no task function');
	const workerUrl = worker.workerUrl;
	pool ??= new Piscina({
		filename: workerUrl,
		execArgv: workerUrl.endsWith('.ts') ? ['--import', 'tsx'] : [],
		// One core stays with the request thread.
		maxThreads: Math.max(1, availableParallelism() - 1),
		minThreads: 1,
		idleTimeout: 60_000,
		maxQueue: 64,
		resourceLimits: { maxOldGenerationSizeMb: 256 }
	});
	await pool.run({ kind: 'ping' });
	return pool;
}

process.on('sveltekit:shutdown', () => void pool?.destroy());

/** Runs a drafting computation on a worker thread, so the request thread stays free for other requests. */
export async function compute<K extends Task['kind']>(
	task: Extract<Task, { kind: K }>,
	options: { budgetMs?: number } = {}
): Promise<TaskResult[K]> {
	const workers = await openPool();
	try {
		return (await workers.run(task, {
			signal: AbortSignal.timeout(options.budgetMs ?? defaultBudgetMs)
		})) as TaskResult[K];
	} catch (error) {
		if (error instanceof Error && error.name === 'AbortError') throw new OverBudget('over budget', { cause: error });
		if (error instanceof Error && /queue is at limit/i.test(error.message)) throw new Busy('busy', { cause: error });
		throw error;
	}
}
