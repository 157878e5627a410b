import { inch, lengthOption, num, waistbandPiece } from './common';
import { skirtInput, skirtOptions, skirtPiece, skirtShaping } from './skirt-common';
import type { GarmentTemplate } from './types';

export const aLineSkirt: GarmentTemplate = {
	id: 'a-line-skirt',
	name: 'A-line skirt',
	summary: 'Flared from the hip: front on the fold, back in two with a centre-back zip, one dart a side, waistband.',
	category: 'skirt',
	requiredMeasurements: ['waist_girth', 'hip_girth', 'waist_to_hip'],
	optionalMeasurements: [],
	// A curved hem turns up less cloth than a straight one: a narrower hem (common practice).
	options: skirtOptions(inch(1), [
		lengthOption('flare', 'Flare at each side seam', inch(2.5), [0, inch(8)], {
			help: 'Extra width at the hem on each side seam.'
		})
	]),
	defaultLabourHours: 4,
	method:
		'Quarter-hip skirt block (back darts twice the front’s, after Aldrich’s close-fitting skirt block) with flare added at the side seam from the hip line (common practice); ease from CWU “Ease in Clothing”.',
	draft(body, options) {
		const input = skirtInput(body, options, { flare: num(options, 'flare'), maxDartsPerQuarter: 1 });
		const shaping = skirtShaping(input);
		const extra = { zipLength: num(options, 'zipLength'), centreBackSeam: inch(1), slitLength: 0 };
		return {
			pieces: [
				skirtPiece('front', input, shaping, extra),
				skirtPiece('back', input, shaping, extra),
				waistbandPiece({
					finishedWaist: input.waist + input.waistEase,
					depth: num(options, 'waistbandDepth'),
					seam: input.seam,
					overlap: inch(1.5),
					lengthLabel: 'Cut length (waist + ease + overlap + seams)'
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance', mm: input.seam },
				{ id: 'centre_back', label: 'Centre back seam allowance (zip)', mm: extra.centreBackSeam },
				{ id: 'hem', label: 'Hem allowance', mm: input.hem },
				{ id: 'hip_ease', label: 'Hip ease (total)', mm: input.hipEase },
				{ id: 'waist_ease', label: 'Waist ease (total)', mm: input.waistEase }
			],
			notes: [
				'Cut the front on the fold and the back as a pair.',
				'The hem curves up at the side so the side seam and centre are the same length.'
			],
			cautions: [],
			warnings: []
		};
	}
};
