// Relative imports only: this module also runs inside worker threads, outside Vite.
import { draftGarment, type DraftResponse } from '../../drafting/draft';
import { estimateQuoteRequest, layoutRectangles, type LayoutResponse } from '../../drafting/requests';
import { draftNestBudget } from '../../drafting/marker/index';
import { patternPdfForRequest, type PaperId, type PatternPdfResult } from '../../drafting/print/index';
import type { DraftRequest, LayoutRequest, QuoteRequest } from '../../drafting/schemas';
import { implausibleRefusal } from './refusals';

/** Computations whose JSON answer the worker can write itself (see `answer` below). */
export type AnswerableTask =
	| { kind: 'draft'; request: DraftRequest }
	| { kind: 'layout'; request: LayoutRequest }
	| { kind: 'estimate'; request: QuoteRequest };

export type Task =
	| { kind: 'ping' }
	| AnswerableTask
	| { kind: 'pattern_pdf'; request: DraftRequest; paper: PaperId }
	| { kind: 'answer'; task: AnswerableTask };

/** An API answer as sent: its status and its JSON body, already written out. */
export type SerialisedAnswer = { status: number; body: string };

export type TaskResult = {
	ping: 'pong';
	draft: DraftResponse;
	layout: LayoutResponse;
	estimate: ReturnType<typeof estimateQuoteRequest>;
	pattern_pdf: PatternPdfResult;
	answer: SerialisedAnswer;
};

/**
 * The task's JSON answer, written where it was computed: a string crosses from a worker thread as one
 * copy, where the result object would be cloned field by field and then written out on the request thread.
 * A draft from implausible measurements is answered 422 instead.
 */
function answer(task: AnswerableTask): SerialisedAnswer {
	if (task.kind === 'draft') {
		const draft = runDraft(task.request);
		const refusal = implausibleRefusal(draft);
		return refusal ? { status: 422, body: JSON.stringify(refusal) } : { status: 200, body: JSON.stringify(draft) };
	}
	const result = task.kind === 'layout' ? layoutRectangles(task.request) : estimateQuoteRequest(task.request);
	return { status: 200, body: JSON.stringify(result) };
}

// Nesting the real outlines takes up to a couple of seconds: only when asked (`nest: true`).
const runDraft = (request: DraftRequest) => draftGarment(request, request.nest ? { nest: draftNestBudget } : {});

export function runTask(task: Task): TaskResult[Task['kind']] | Promise<TaskResult[Task['kind']]> {
	switch (task.kind) {
		case 'ping':
			return 'pong';
		case 'draft':
			return runDraft(task.request);
		case 'layout':
			return layoutRectangles(task.request);
		case 'estimate':
			return estimateQuoteRequest(task.request);
		case 'pattern_pdf':
			return patternPdfForRequest(task.request, task.paper);
		case 'answer':
			return answer(task.task);
	}
}
