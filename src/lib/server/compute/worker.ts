import { runTask, type Task } from './tasks';

/** Loaded by the pool inside each worker thread; the pool finds this file through `workerUrl`. */
export default function computeInWorker(task: Task) {
	return runTask(task);
}

export const workerUrl = import.meta.url;
