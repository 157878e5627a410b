import { garmentIds, type DraftRequest, type DraftResponse, type GarmentId, type Unit } from '$lib/drafting';
import { Busy, compute, OverBudget } from '$lib/server/compute';
import { answerCache, type Answer } from '$lib/server/compute/answers';

export type AwardedDraft =
	{ ok: true; result: DraftResponse } | { ok: false; reason: 'no_template' | 'unavailable' | 'no_measurements' };

/** Drafts for frozen measurements never change: each is nested once (up to a couple of seconds), then kept. */
const drafts = answerCache({ maxEntries: 200, maxBytes: 32 * 1024 * 1024 });

/**
 * The cutting draft and fabric layout for the awarded tailor, from the frozen measurements in the unit they
 * were taken in. Worked out on the compute pool, like the drafting API; a garment without a template
 * (`other`) has none.
 */
export async function draftForAwarded(
	garment: string,
	measurements: { unit: Unit; values: Record<string, number> } | null
): Promise<AwardedDraft> {
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
	const answer = await drafts.get(request, async (): Promise<Answer> => {
		try {
			const result = await compute({ kind: 'draft', request });
			return { status: 200, body: JSON.stringify(result), headers: {}, keep: true };
		} catch (error) {
			if (error instanceof OverBudget || error instanceof Busy)
				return { status: 503, body: '', headers: {}, keep: false };
			throw error;
		}
	});
	return answer.status === 200
		? { ok: true, result: JSON.parse(answer.body) as DraftResponse }
		: { ok: false, reason: 'unavailable' };
}
