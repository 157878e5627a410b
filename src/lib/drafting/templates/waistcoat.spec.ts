import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { defaultFabricSpec, estimateFabric } from '../fabric';
import { boundingBox, distance, polygonArea } from '../geometry';
import { netOutline, pathLength, type NetEdge } from './seams';
import { distanceToOutline, draftIn, resolvedFor, sampleAlong, spanAt, standardBodyCm } from './test-support';
import { waistcoat, waistcoatNet, weltDepth } from './waistcoat';

const inch = 25.4;
const body = {
	bust_girth: standardBodyCm.bust_girth,
	waist_girth: standardBodyCm.waist_girth,
	hip_girth: standardBodyCm.hip_girth,
	neck_girth: standardBodyCm.neck_girth,
	shoulder_width: standardBodyCm.shoulder_width,
	nape_to_waist: standardBodyCm.nape_to_waist,
	waist_to_hip: standardBodyCm.waist_to_hip
};

const len = (edges: NetEdge[], id: string) => pathLength(edges.find((e) => e.id === id)!.points);

function netOf(bodyCm: Record<string, number> = body, options: Record<string, string | number | boolean> = {}) {
	const { body: mm, options: resolved } = resolvedFor(waistcoat, bodyCm, options);
	return { net: waistcoatNet(mm, resolved), seam: resolved.seamAllowance as number };
}

const pieceOf = (draft: ReturnType<typeof draftIn>, id: string) => draft.pieces.find((p) => p.id === id)!;

/** Finished girth at `y` from the cut pieces: the front from the centre front, the back from its centre back seam. */
function finishedGirth(draft: ReturnType<typeof draftIn>, y: number, seam: number) {
	const front = spanAt(pieceOf(draft, 'front').outline, y).max - seam;
	const back = spanAt(pieceOf(draft, 'back').outline, y);
	return 2 * (front + (back.max - back.min - 2 * seam));
}

describe('waistcoat — ease from the cut pieces', () => {
	it('gives McCunn’s 4 in chest fitting ease at regular, 3 in fitted and 6 in relaxed (How to Make Sewing Patterns; common practice)', () => {
		for (const [fit, ease] of [
			['fitted', 3],
			['regular', 4],
			['relaxed', 6]
		] as const) {
			const draft = draftIn(waistcoat, 'cm', body, { fit });
			const { net, seam } = netOf(body, { fit });
			const underarm = net.back.find((e) => e.id === 'armhole')!.points.at(-1)!;
			// Measured where the side allowance meets the armhole's: to a hundredth of an inch.
			expect((finishedGirth(draft, underarm.y, seam) - body.bust_girth * 10) / inch).toBeCloseTo(ease, 1);
			// The finished figures the draft states are the cut widths less their allowances (to a millimetre at
			// the underarm, where the side seam's allowance turns into the armhole's).
			expect(Math.abs(draft.line('front.finished_chest') * 10 - finishedGirth(draft, underarm.y, seam))).toBeLessThan(
				1
			);
			expect(
				Math.abs(draft.line('front.finished_waist') * 10 - finishedGirth(draft, net.figures.waistY, seam))
			).toBeLessThan(1);
		}
	});

	it('gives at least the CWU dress-waist minimum (¾ in) at the waist and at the hem for any plausible body, waist larger than hip included (property)', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 80, max: 140, noNaN: true }),
				fc.double({ min: 55, max: 150, noNaN: true }),
				fc.double({ min: 80, max: 150, noNaN: true }),
				(chest, waist, hip) => {
					const b = { ...body, bust_girth: chest, waist_girth: waist, hip_girth: hip };
					const draft = draftIn(waistcoat, 'cm', b);
					const { net, seam } = netOf(b);
					const f = net.figures;
					expect(finishedGirth(draft, f.waistY, seam) - waist * 10).toBeGreaterThanOrEqual(0.75 * inch - 1e-6);
					// At the back hem the body lies between its waist and hip; it passes the larger of the two there.
					const atHem = waist + ((hip - waist) * 60) / (body.waist_to_hip * 10);
					expect(finishedGirth(draft, f.hemY - 1, seam) - Math.max(waist, atHem) * 10).toBeGreaterThanOrEqual(
						0.75 * inch - 1
					);
				}
			),
			{ numRuns: 60 }
		);
	});
});

// Seam allowance 5/8 in by default (Wikipedia, "Seam allowance"); a bagged-out edge is a seam (common practice).
describe('waistcoat — bagged out: every edge carries the seam allowance', () => {
	it('puts the seam allowance inside the cutting line all along every edge of every piece', () => {
		const { net, seam } = netOf();
		const draft = draftIn(waistcoat, 'cm', body);
		const pieces = {
			front: 'front',
			facing: 'front_facing',
			frontLining: 'front_lining',
			back: 'back',
			lowerWelt: 'welt',
			lowerBag: 'pocket_bag',
			breastWelt: 'breast_welt',
			breastBag: 'breast_bag'
		} as const;
		for (const [key, id] of Object.entries(pieces)) {
			const outline = pieceOf(draft, id).outline;
			for (const e of net[key as keyof typeof pieces]) {
				for (const p of sampleAlong(e.points, 3 * seam)) {
					expect(distanceToOutline(p, outline), `${id}.${e.id}`).toBeCloseTo(seam, 1);
				}
			}
		}
	});
});

// Pieces sewn together are cut to the same seam length (common practice).
describe('waistcoat — facing and lining sewn together', () => {
	it('cuts the facing to the front edges it is sewn to, neck point to front point', () => {
		const { net } = netOf();
		for (const id of ['front_point', 'front_edge', 'lapel_edge'])
			expect(len(net.facing, id)).toBeCloseTo(len(net.front, id), 9);
	});
	it('cuts the front lining to the facing’s inner edge', () => {
		const { net } = netOf();
		expect(len(net.frontLining, 'facing_seam')).toBeCloseTo(len(net.facing, 'lining_seam'), 9);
	});
	it('makes facing and lining together exactly the front, on the seam lines (areas add up)', () => {
		const { net } = netOf();
		const area = (edges: NetEdge[]) => polygonArea(netOutline(edges));
		expect(area(net.facing) + area(net.frontLining)).toBeCloseTo(area(net.front), 3);
	});
	it('keeps the facing 5 cm wide along the front edge (common practice 4–6 cm)', () => {
		const { net } = netOf();
		const inner = net.facing.find((e) => e.id === 'lining_seam')!.points;
		const edge = net.front.find((e) => e.id === 'front_edge')!.points;
		const mid = { x: edge[0].x, y: (edge[0].y + edge[1].y) / 2 };
		expect(distanceToOutline(mid, inner) - 0).toBeCloseTo(50, 6);
	});
});

// Welt depth 2 cm, mouth sizes and bag depths: from memory; a welt is cut to its mouth (common practice).
describe('waistcoat — welt pockets marked and their welts cut to the mouth', () => {
	it('marks two pocket mouths (lower and breast) inside the front, clear of the facing', () => {
		const draft = draftIn(waistcoat, 'cm', body);
		const { net } = netOf();
		const front = netOutline(net.front);
		const facing = netOutline(net.facing);
		const mouths = pieceOf(draft, 'front').marks.filter((m) => m.kind === 'slit');
		expect(mouths.map((m) => m.label)).toEqual(['welt pocket mouth', 'breast welt (left front only) mouth']);
		for (const m of mouths) {
			for (const p of m.points) {
				expect(distanceToOutline(p, front)).toBeGreaterThan(20);
				const { min, max } = spanAt(facing, p.y);
				expect(p.x < min || p.x > max).toBe(true);
			}
		}
	});
	it('cuts each welt as long as its pocket mouth, double the welt depth, with an allowance all round', () => {
		const draft = draftIn(waistcoat, 'cm', body);
		const { seam } = netOf();
		const mouths = pieceOf(draft, 'front').marks.filter((m) => m.kind === 'slit');
		for (const [i, id] of ['welt', 'breast_welt'].entries()) {
			const box = boundingBox(pieceOf(draft, id).outline);
			const mouth = distance(mouths[i].points[0], mouths[i].points[1]);
			expect(box.width - 2 * seam).toBeCloseTo(mouth, 6);
			expect(box.height - 2 * seam).toBeCloseTo(2 * weltDepth, 6);
		}
	});
	it('leaves the breast pocket off when it is not wanted', () => {
		const draft = draftIn(waistcoat, 'cm', body, { breastPocket: false });
		expect(draft.pieces.map((p) => p.id)).not.toContain('breast_welt');
		expect(pieceOf(draft, 'front').marks.filter((m) => m.kind === 'slit')).toHaveLength(1);
	});
});

// The lining length is never below the trivial strip-packing area bound (theoremdep, "rvol(I) is a lower bound").
describe('waistcoat — lining laid apart from the cloth', () => {
	it('lays only the cloth pieces and gives the lining its own length in the notes', () => {
		const draft = draftIn(waistcoat, 'cm', body);
		const { estimate } = estimateFabric(draft.pieces, defaultFabricSpec('cm'), 'cm');
		const lining = draft.pieces.filter((p) => p.cut.cloth === 'lining').map((p) => p.id);
		expect(lining.sort()).toEqual(['back', 'back_lining', 'breast_bag', 'front_lining', 'pocket_bag']);
		expect(estimate!.placements.some((p) => lining.includes(p.pieceId))).toBe(false);
		const note = estimate!.notes.find((n) => n.startsWith('Lining'))!;
		const metres = Number(/: ([\d.]+) m of/.exec(note)![1]);
		// Never less than the lining's area over the folded lining width (the trivial strip-packing bound).
		const area = draft.pieces
			.filter((p) => p.cut.cloth === 'lining')
			.reduce((sum, p) => sum + polygonArea(p.outline) * p.cut.quantity, 0);
		expect(metres * 1000).toBeGreaterThanOrEqual(area / 1150);
	});
	it('puts the back in the cloth when asked', () => {
		const draft = draftIn(waistcoat, 'cm', body, { backInLining: false });
		const { estimate } = estimateFabric(draft.pieces, defaultFabricSpec('cm'), 'cm');
		expect(estimate!.placements.some((p) => p.pieceId === 'back')).toBe(true);
	});
});

// Datums after Aldrich's menswear body block (edition and chapter from memory).
describe('waistcoat — datums from the nape (Aldrich, Metric Pattern Cutting for Menswear, 5th ed., body block)', () => {
	it('puts the waist line nape-to-waist below the nape', () => {
		const draft = draftIn(waistcoat, 'cm', body);
		const { seam } = netOf();
		const back = pieceOf(draft, 'back');
		const nape = Math.min(...back.outline.filter((p) => Math.abs(p.x + seam) < 1e-6).map((p) => p.y)) + seam;
		const waistLine = back.marks.find((m) => m.label === 'waist line')!.points[0].y;
		// To half a millimetre: the back neck is drawn in short chords, so its allowance meets the centre back a little off.
		expect(waistLine - nape).toBeCloseTo(body.nape_to_waist * 10, 0);
	});
	it('spaces the buttons evenly from the top of the V to above the points', () => {
		const { net } = netOf(body, { buttons: '6' });
		const b = net.figures.buttons;
		expect(b).toHaveLength(6);
		const gaps = b.slice(1).map((y, i) => y - b[i]);
		for (const gap of gaps) expect(gap).toBeCloseTo(gaps[0], 9);
	});
});

describe('waistcoat — cautions', () => {
	it('cautions about buttons on a small child’s waistcoat only', () => {
		const child = { ...body, stature: 110, bust_girth: 58, waist_girth: 54, hip_girth: 60, neck_girth: 27 };
		expect(draftIn(waistcoat, 'cm', child).cautions.map((c) => c.code)).toEqual(['child_buttons']);
		expect(draftIn(waistcoat, 'cm', body).cautions).toEqual([]);
	});
});
