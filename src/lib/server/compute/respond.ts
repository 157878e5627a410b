import { json } from '@sveltejs/kit';
import { implausibleCodes, type DraftResponse } from '../../drafting/draft';
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
	return computeAnswer(task, (result) => refuse?.(result) ?? json(result));
}

/** As computeResponse, with the route shaping the answer from the result (a file rather than JSON). */
export async function computeAnswer<K extends Task['kind']>(
	task: Extract<Task, { kind: K }>,
	answer: (result: TaskResult[K]) => Response
): Promise<Response> {
	try {
		return answer(await compute<K>(task));
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

/** A draft from values no body has, or from an unconfirmed unit mix-up, is refused rather than drawn. */
export function refuseImplausible(draft: DraftResponse): Response | null {
	const implausible = draft.errors.filter((e) => implausibleCodes.has(e.code));
	if (!implausible.length) return null;
	return apiError(
		422,
		'implausible_measurements',
		implausible.some((e) => e.code === 'unit_mixup')
			? 'Some measurements look like another unit. Correct them, change the unit, or send unitConfirmed: true if they are right.'
			: 'Some measurements cannot be right. Please correct them.',
		implausible.flatMap((e) => e.fields.map((field) => ({ path: `measurements.${field}`, message: e.message })))
	);
}
