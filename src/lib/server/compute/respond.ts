import { json } from '@sveltejs/kit';
import { apiError } from '../http/respond';
import { Busy, compute, OverBudget } from './index';
import type { Task, TaskResult } from './tasks';

/**
 * Runs the task off the request thread and answers its JSON, 422 when it ran over budget, 503 when busy.
 * `refuse` may turn a computed result into an error answer instead.
 */
export async function computeResponse<K extends Task['kind']>(
	task: Extract<Task, { kind: K }>,
	refuse?: (result: TaskResult[K]) => Response | null
): Promise<Response> {
	try {
		const result = await compute<K>(task);
		return refuse?.(result) ?? json(result);
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
