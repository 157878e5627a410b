import { json } from '@sveltejs/kit';
import { apiError } from '../http/respond';
import { Busy, compute, OverBudget } from './index';
import type { Task, TaskResult } from './tasks';

/** Runs the task off the request thread and answers its JSON, 422 when it ran over budget, 503 when busy. */
export async function computeResponse<K extends Task['kind']>(task: Extract<Task, { kind: K }>): Promise<Response> {
	try {
		return json(await compute<K>(task));
	} catch (error) {
		if (error instanceof OverBudget) {
			return apiError(
				422,
				'too_complex',
				'This request takes too long to work out. Send fewer or larger pieces, or split it into several requests.'
			);
		}
		if (error instanceof Busy) {
			return apiError(503, 'busy', 'Tackline is busy working out other requests. Try again in a few seconds.', [], {
				'retry-after': '5'
			});
		}
		throw error;
	}
}
export type { TaskResult };
