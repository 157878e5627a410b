import { inch, lengthOption, num, waistbandPiece } from './common';
import { skirtInput, skirtOptions, skirtPiece, skirtShaping } from './skirt-common';
import type { GarmentTemplate } from './types';

export const straightSkirt: GarmentTemplate = {
	id: 'straight-skirt',
	name: 'Straight skirt',
	summary: 'Front on the fold, back in two with a centre-back zip and walking slit, waist darts and a waistband.',
	category: 'skirt',
	requiredMeasurements: ['waist_girth', 'hip_girth', 'waist_to_hip'],
	optionalMeasurements: [],
	options: skirtOptions(inch(1.5), [lengthOption('slitLength', 'Walking slit at centre back', inch(6), [0, inch(12)])]),
	defaultLabourHours: 5,
	method:
		'Quarter-hip skirt block with waist darts, the back taking twice the front’s dart intake (Aldrich, Metric Pattern Cutting for Women’s Wear, close-fitting skirt block); wearing ease from CWU “Ease in Clothing” (hip 2–2¾ in, skirt waist ½–¾ in).',
	draft(body, options) {
		const input = skirtInput(body, options, { flare: null, maxDartsPerQuarter: 2 });
		const shaping = skirtShaping(input);
		// Centre back carries a wider allowance for the zip: up to 1 in where fitting room is needed (industry practice).
		const extra = {
			zipLength: num(options, 'zipLength'),
			centreBackSeam: inch(1),
			slitLength: num(options, 'slitLength')
		};
		const overlap = inch(1.5);
		return {
			pieces: [
				skirtPiece('front', input, shaping, extra),
				skirtPiece('back', input, shaping, extra),
				waistbandPiece({
					finishedWaist: input.waist + input.waistEase,
					depth: num(options, 'waistbandDepth'),
					seam: input.seam,
					overlap: overlap,
					lengthLabel: 'Cut length (waist + ease + overlap + seams)'
				})
			],
			allowances: [
				{ id: 'seam', label: 'Seam allowance', mm: input.seam },
				{ id: 'centre_back', label: 'Centre back seam allowance (zip)', mm: extra.centreBackSeam },
				{ id: 'hem', label: 'Hem allowance', mm: input.hem },
				{ id: 'hip_ease', label: 'Hip ease (total)', mm: input.hipEase },
				{ id: 'waist_ease', label: 'Waist ease (total)', mm: input.waistEase },
				{ id: 'waistband_depth', label: 'Finished waistband depth', mm: num(options, 'waistbandDepth') }
			],
			notes: [
				'Cut the front on the fold and the back as a pair.',
				'Leave the centre back open for the zip at the top and the slit at the hem.'
			],
			cautions: [],
			warnings: []
		};
	}
};
