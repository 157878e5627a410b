import { describe, expect, it } from 'vitest';
import { estimateFabric } from './fabric';
import { escapeXml, layoutSvg, pieceSvg } from './svg';
import { croppedTop } from './templates/cropped-top';
import { draftIn } from './templates/test-support';
import { wideLegTrousers } from './templates/wide-leg-trousers';

const trousers = draftIn(wideLegTrousers, 'in', { hip_girth: 40, waist_girth: 28, thigh_girth: 25 }, { length: 45.5 });
const top = draftIn(croppedTop, 'in', {
	bust_girth: 36,
	shoulder_width: 15,
	shoulder_to_bust_point: 9.5,
	bust_point_span: 7
});

describe('pieceSvg', () => {
	it('labels dimensions in the viewer’s unit', () => {
		const front = trousers.pieces[0];
		expect(pieceSvg(front, 'in')).toContain('>11 in<'); // hip width, common-practice example
		expect(pieceSvg(front, 'cm')).toContain('>27.9 cm<');
		expect(pieceSvg(front, 'in')).toContain('>11 1/2 in<'); // crotch depth
	});

	it('draws a grainline, a title and the cut instruction', () => {
		const svg = pieceSvg(trousers.pieces[0], 'in');
		expect(svg).toMatch(/^<svg [^>]*role="img"/);
		expect(svg).toContain('<title>Front: Cut 2 (a pair), lengthwise grain</title>');
		expect(svg).toContain('>grain<');
		expect(svg).not.toContain('place on fold');
	});

	it('marks the fold on cut-on-fold pieces and draws darts', () => {
		const svg = pieceSvg(top.pieces[0], 'in');
		expect(svg).toContain('place on fold');
		expect(svg).toContain('Cut 1 on fold');
		expect(svg.match(/stroke="#a93c25" stroke-width="1.5"/g)?.length).toBeGreaterThanOrEqual(2);
	});

	it('is well-formed XML with escaped text', () => {
		expect(escapeXml('a < b & "c"')).toBe('a &lt; b &amp; &quot;c&quot;');
		const svg = pieceSvg(trousers.pieces[1], 'cm');
		expect(svg.match(/<svg/g)).toHaveLength(1);
		expect(svg.endsWith('</svg>')).toBe(true);
		expect(svg).not.toMatch(/NaN|undefined|Infinity/);
	});
});

describe('layoutSvg', () => {
	it('shows the fold, yard marks and every placement', () => {
		const { estimate } = estimateFabric(
			trousers.pieces,
			{ widthMm: 45 * 25.4, folded: true, directional: false, shrinkagePercent: 0, repeatMm: 0 },
			'in'
		);
		const svg = layoutSvg(estimate!, 'in');
		expect(svg).toContain('>fold<');
		expect(svg).toContain('>1 yd<');
		expect(svg).toContain('Front ×2');
		expect(svg.match(/<g transform/g)).toHaveLength(estimate!.placements.length);
		expect(svg).not.toMatch(/NaN|undefined|Infinity/);
	});
});
