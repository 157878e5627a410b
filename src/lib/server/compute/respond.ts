import { json } from '@sveltejs/kit';
import type { DraftResponse } from '../../drafting/draft';
import { apiError } from '../http/respond';
import { answerCache, type Answer } from './answers';
import { Busy, compute, OverBudget } from './index';
import { implausibleRefusal } from './refusals';
import type { AnswerableTask, Task, TaskResult } from './tasks';

/** The answer when the task could not be worked out: over its budget (422) or no room in the pool (503). */
function failure(error: unknown): Response {
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

/** Drafts, layouts and estimates answered lately: a repeated request (a client polling, a page reloaded) costs nothing. */
const answers = answerCache({ maxEntries: 500, maxBytes: 32 * 1024 * 1024 });

/**
 * Runs the task off the request thread and answers its JSON (a draft from implausible measurements: 422),
 * 422 when it ran over budget, 503 when busy. The worker writes the JSON itself, so the answer crosses
 * threads as one string. What was computed is kept for the same request; running over budget or finding
 * the pool busy is not.
 */
export async function computeResponse(task: AnswerableTask): Promise<Response> {
	const answer = await answers.get(task, async (): Promise<Answer> => {
		try {
			const { status, body } = await compute({ kind: 'answer', task });
			return { status, body, headers: {}, keep: true };
		} catch (error) {
			const response = failure(error);
			const retryAfter = response.headers.get('retry-after');
			return {
				status: response.status,
				body: await response.text(),
				headers: retryAfter ? { 'retry-after': retryAfter } : {},
				keep: false
			};
		}
	});
	// The same request always gets this answer, whoever sends it: server/pure-answers.js may send it again.
	const pure: Record<string, string> = answer.keep && answer.status === 200 ? { 'x-tackline-pure': '1' } : {};
	return new Response(bytesOf(answer), {
		status: answer.status,
		headers: { 'content-type': 'application/json', ...answer.headers, ...pure }
	});
}

/** Answers as UTF-8, encoded once: a kept answer sent again is not encoded again. */
const encoded = new WeakMap<Answer, Uint8Array<ArrayBuffer>>();
const encoder = new TextEncoder();
function bytesOf(answer: Answer): Uint8Array<ArrayBuffer> {
	let bytes = encoded.get(answer);
	if (!bytes) {
		bytes = encoder.encode(answer.body);
		encoded.set(answer, bytes);
	}
	return bytes;
}

/** As computeResponse, with the route shaping the answer from the result (a file rather than JSON); nothing is kept. */
export async function computeAnswer<K extends Task['kind']>(
	task: Extract<Task, { kind: K }>,
	answer: (result: TaskResult[K]) => Response
): Promise<Response> {
	let result: TaskResult[K];
	try {
		result = await compute<K>(task);
	} catch (error) {
		return failure(error);
	}
	return answer(result);
}
export type { TaskResult };

/** A draft from values no body has, or from an unconfirmed unit mix-up, is refused rather than drawn. */
export function refuseImplausible(draft: DraftResponse): Response | null {
	const refusal = implausibleRefusal(draft);
	return refusal && json(refusal, { status: 422 });
}
