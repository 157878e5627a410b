import type { ServerLoadEvent } from '@sveltejs/kit';
import { garmentIds, type DraftRequest, type DraftResponse, type GarmentId, type Unit } from '$lib/drafting';
import { Busy, compute, OverBudget } from '$lib/server/compute';
import { answerCache, type Answer } from '$lib/server/compute/answers';
import { awardedDraftDependency, type AwardedDraft } from './awarded-draft';

/** Drafts for frozen measurements never change: each is nested once (up to a couple of seconds), then kept. */
const drafts = answerCache({ maxEntries: 200, maxBytes: 32 * 1024 * 1024 });

const fromAnswer = (answer: Answer): AwardedDraft =>
	answer.status === 200
		? { ok: true, result: JSON.parse(answer.body) as DraftResponse }
		: { ok: false, reason: 'unavailable' };

/**
 * The cutting draft and fabric layout for the awarded tailor, from the frozen measurements in the unit they
 * were taken in. Worked out on the compute pool, like the drafting API; a garment without a template
 * (`other`) has none. A draft worked out before comes at once; otherwise a promise, which the page streams
 * in after the rest of it (nesting takes up to a couple of seconds).
 */
function draftForAwarded(
	garment: string,
	measurements: { unit: Unit; values: Record<string, number> } | null
): AwardedDraft | Promise<AwardedDraft> {
	if (!measurements) return { ok: false, reason: 'no_measurements' };
	if (!(garmentIds as readonly string[]).includes(garment)) return { ok: false, reason: 'no_template' };
	const request: DraftRequest = {
		garment: garment as GarmentId,
		unit: measurements.unit,
		measurements: measurements.values,
		// The customer's profile checks already asked about suspected unit mix-ups before publishing.
		unitConfirmed: true,
		// The cutting sheet is what the tailor buys cloth by: the real outlines, nested.
		nest: true
	};
	const kept = drafts.peek(request);
	if (kept) return fromAnswer(kept);
	return drafts
		.get(request, async (): Promise<Answer> => {
			try {
				const result = await compute({ kind: 'draft', request });
				return { status: 200, body: JSON.stringify(result), headers: {}, keep: true };
			} catch (error) {
				if (error instanceof OverBudget || error instanceof Busy)
					return { status: 503, body: '', headers: {}, keep: false };
				throw error;
			}
		})
		.then(fromAnswer);
}

/** What of a page's load the draft needs: whether it is a data request, where to say "do not keep", how to ask again. */
export type DraftPage = Pick<ServerLoadEvent, 'isDataRequest' | 'setHeaders' | 'locals' | 'depends'>;

/**
 * The draft as a page's load gives it. A draft still being nested does not hold up the page: a data request
 * (the browser's own, after the page has loaded) gets it as a promise, streamed; a first page load, whose inline
 * scripts the content security policy fixes in advance, gets `working`, and the page asks again.
 */
export function awardedDraftForPage(
	page: DraftPage,
	garment: string,
	measurements: { unit: Unit; values: Record<string, number> } | null
): AwardedDraft | Promise<AwardedDraft> {
	const draft = draftForAwarded(garment, measurements);
	if (!(draft instanceof Promise) || page.isDataRequest) return draft;
	// It goes on being worked out, and is kept for the page's next request; this page is not stored anywhere.
	draft.catch(() => {});
	page.setHeaders({ 'cache-control': 'no-store' });
	page.locals.unkept = true;
	page.depends(awardedDraftDependency);
	return { ok: false, reason: 'working' };
}
