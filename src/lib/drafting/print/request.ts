import { draftInputFromRequest, draftWithPieces, type DraftResponse } from '../draft';
import { measurementInfo, type MeasurementCode } from '../measurements';
import type { DraftRequest } from '../schemas';
import { formatLength } from '../units';
import type { PaperId } from './paper';
import { patternPdf } from './pdf';

export type PatternPdfResult = { ok: true; pdf: Uint8Array } | { ok: false; draft: DraftResponse };

/** The full-size pattern for a draft request (the same request as POST /api/v1/drafts), or the stopped draft. */
export async function patternPdfForRequest(request: DraftRequest, paper: PaperId): Promise<PatternPdfResult> {
	const input = draftInputFromRequest(request);
	const { response, pieces } = draftWithPieces(input);
	if (response.errors.length || !pieces.length) return { ok: false, draft: response };
	const measured = Object.entries(input.bodyMm).map(
		([code, mm]) =>
			`${measurementInfo[code as MeasurementCode].label.toLowerCase()} ${formatLength(mm, input.unit, { withUnit: true })}`
	);
	const band = response.sizeBand ? ` · ${response.sizeBand.text}` : '';
	const pdf = await patternPdf({
		title: response.name,
		subtitle: `For ${measured.join(', ')}${band}`,
		pieces,
		paper
	});
	return { ok: true, pdf };
}
