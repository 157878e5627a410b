import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { estimateFabric } from './fabric';
import { escapeXml, layoutSvg, phoneScale, pieceLayout, pieceSvg } from './svg';
import { placeDimensionLabels, rectsOverlap, textRect, type Rect } from './svg-labels';
import { templates } from './templates/index';
import { croppedTop } from './templates/cropped-top';
import { draftIn, standardBodyCm } from './templates/test-support';
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

describe('pieceSvg on a 360 px phone', () => {
	const dimensionTexts = (svg: string) =>
		[
			...svg.matchAll(
				/<text x="([-\d.]+)" y="([-\d.]+)" font-size="([\d.]+)" text-anchor="middle" dominant-baseline="middle" fill="#24495a"(?: transform="rotate\(([-\d.]+) [^"]*\)")?[^>]*>([^<]*)<\/text>/g
			)
		].map((m) => ({
			at: { x: Number(m[1]), y: Number(m[2]) },
			fontSize: Number(m[3]),
			rotate: Number(m[4] ?? 0),
			text: m[5]
		}));
	const viewBox = (svg: string) => {
		const [x, y, width, height] = svg
			.match(/viewBox="([^"]+)"/)![1]
			.split(' ')
			.map(Number);
		return { x, y, width, height };
	};
	const shrink = (r: Rect, by: number): Rect => ({ x0: r.x0 + by, y0: r.y0 + by, x1: r.x1 - by, y1: r.y1 - by });

	it('draws every dimension label at least 11 px high, clear of the other labels and of the fold bracket, for every garment, fit and unit (property)', () => {
		fc.assert(
			fc.property(
				fc.constantFrom(...Object.values(templates)),
				fc.constantFrom('fitted', 'regular', 'relaxed'),
				fc.constantFrom('in' as const, 'cm' as const),
				fc.double({ min: 0.85, max: 1.3, noNaN: true }),
				(template, fit, unit, scale) => {
					const body = Object.fromEntries(
						Object.entries(standardBodyCm).map(([k, v]) => [k, k.endsWith('girth') ? v * scale : v])
					);
					for (const piece of draftIn(template, 'cm', body, { fit }).pieces) {
						const svg = pieceSvg(piece, unit);
						const labels = dimensionTexts(svg);
						expect(labels).toHaveLength(piece.lines.filter((l) => l.dimension).length);
						const px = phoneScale(viewBox(svg));
						const rects = labels.map((l) => shrink(textRect(l.at, l.text, l.fontSize, l.rotate), 0.1));
						const fold = pieceLayout(piece, unit).fold;
						labels.forEach((l, i) => {
							expect(l.fontSize * px, `${piece.id} ${l.text}`).toBeGreaterThanOrEqual(11);
							for (const other of rects.slice(i + 1)) expect(rectsOverlap(rects[i], other)).toBe(false);
							if (fold) expect(rectsOverlap(rects[i], fold), `${piece.id} ${l.text} on the fold bracket`).toBe(false);
						});
					}
				}
			),
			{ numRuns: 30 }
		);
	});

	it('moves a label along its line or outwards when the middle is taken', () => {
		const from = { x: 0, y: 0 };
		const placed = placeDimensionLabels(
			[
				{ from, to: { x: 0, y: 100 }, text: '10 cm' },
				{ from, to: { x: 0, y: 100 }, text: '10 cm' }
			],
			8,
			{ x: 10, y: 0, width: 100, height: 100 },
			[]
		);
		expect(placed[0].at).toEqual({ x: -6.4, y: 50 });
		expect(rectsOverlap(placed[0].rect, placed[1].rect)).toBe(false);
	});
});
