// Relative imports only: this module also runs inside worker threads, outside Vite.
import { draftGarment, type DraftResponse } from '../../drafting/draft';
import { estimateQuoteRequest, layoutRectangles, type LayoutResponse } from '../../drafting/requests';
import { draftNestBudget } from '../../drafting/marker/index';
import { patternPdfForRequest, type PaperId, type PatternPdfResult } from '../../drafting/print/index';
import type { DraftRequest, LayoutRequest, QuoteRequest } from '../../drafting/schemas';

export type Task =
	| { kind: 'ping' }
	| { kind: 'draft'; request: DraftRequest }
	| { kind: 'layout'; request: LayoutRequest }
	| { kind: 'estimate'; request: QuoteRequest }
	| { kind: 'pattern_pdf'; request: DraftRequest; paper: PaperId };

export type TaskResult = {
	ping: 'pong';
	draft: DraftResponse;
	layout: LayoutResponse;
	estimate: ReturnType<typeof estimateQuoteRequest>;
	pattern_pdf: PatternPdfResult;
};

export function runTask(task: Task): TaskResult[Task['kind']] | Promise<TaskResult[Task['kind']]> {
	switch (task.kind) {
		case 'ping':
			return 'pong';
		case 'draft':
			// Nesting the real outlines takes up to a couple of seconds: only when asked (`nest: true`).
			return draftGarment(task.request, task.request.nest ? { nest: draftNestBudget } : {});
		case 'layout':
			return layoutRectangles(task.request);
		case 'estimate':
			return estimateQuoteRequest(task.request);
		case 'pattern_pdf':
			return patternPdfForRequest(task.request, task.paper);
	}
}
