import { garmentIds, type DraftRequest, type DraftResponse, type GarmentId, type Unit } from '$lib/drafting';
import { Busy, compute, OverBudget } from '$lib/server/compute';

export type AwardedDraft =
	{ ok: true; result: DraftResponse } | { ok: false; reason: 'no_template' | 'unavailable' | 'no_measurements' };

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
	try {
		return { ok: true, result: await compute({ kind: 'draft', request }) };
	} catch (error) {
		if (error instanceof OverBudget || error instanceof Busy) return { ok: false, reason: 'unavailable' };
		throw error;
	}
}
