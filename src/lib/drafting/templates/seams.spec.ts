import { describe, expect, it } from 'vitest';
import { boundingBox, polygonArea, pt, type Point } from '../geometry';
import { cubicCurve, cutOutline, pathLength, type NetEdge } from './seams';

/** A w × h rectangle on the seam line, clockwise on screen from the top left, with an allowance per side. */
function rectangle(w: number, h: number, [top, right, bottom, left]: number[]): NetEdge[] {
	return [
		{ id: 'top', points: [pt(0, 0), pt(w, 0)], allowance: top },
		{ id: 'right', points: [pt(w, 0), pt(w, h)], allowance: right },
		{ id: 'bottom', points: [pt(w, h), pt(0, h)], allowance: bottom },
		{ id: 'left', points: [pt(0, h), pt(0, 0)], allowance: left }
	];
}

const reversed = (edges: NetEdge[]): NetEdge[] =>
	[...edges].reverse().map((e) => ({ ...e, points: [...e.points].reverse() }));

describe('cutOutline (hand checks)', () => {
	it('adds 1 cm all round a 10 × 5 cm rectangle: 12 × 7 cm, 84 cm²', () => {
		const cut = cutOutline(rectangle(100, 50, [10, 10, 10, 10]));
		expect(boundingBox(cut)).toEqual({ x: -10, y: -10, width: 120, height: 70 });
		expect(polygonArea(cut)).toBeCloseTo(8400, 9);
	});
	it('gives each edge its own allowance: nothing on a fold, a deep hem', () => {
		const cut = cutOutline(rectangle(100, 50, [10, 15, 30, 0]));
		expect(boundingBox(cut)).toEqual({ x: 0, y: -10, width: 115, height: 90 });
	});
	it('does not depend on which way round the edges are given', () => {
		const a = cutOutline(rectangle(100, 50, [10, 15, 30, 0]));
		const b = cutOutline(reversed(rectangle(100, 50, [10, 15, 30, 0])));
		expect(boundingBox(b)).toEqual(boundingBox(a));
		expect(polygonArea(b)).toBeCloseTo(polygonArea(a), 9);
	});
	it('mitres a right-angled triangle’s corners: legs 30 and 40 with 5 mm all round', () => {
		// The offset of a triangle by d has area A + d·P + d²·Σcot(θ/2) for its mitred corners (hand algebra):
		// A = 600, P = 120, and cot(45°) + cot(θ₁/2) + cot(θ₂/2) with tan θ₁ = 3/4, tan θ₂ = 4/3 gives 1 + 3 + 2 = 6.
		const tri: NetEdge[] = [
			{ id: 'a', points: [pt(0, 0), pt(40, 0)], allowance: 5 },
			{ id: 'b', points: [pt(40, 0), pt(0, 30)], allowance: 5 },
			{ id: 'c', points: [pt(0, 30), pt(0, 0)], allowance: 5 }
		];
		expect(polygonArea(cutOutline(tri))).toBeCloseTo(600 + 5 * 120 + 25 * 6, 6);
	});
	it('bevels a corner too sharp to mitre instead of throwing a spike (a 10° point)', () => {
		const tip = pt(200, 0);
		const foot = pt(0, 200 * Math.tan(Math.PI / 18));
		const sharp: NetEdge[] = [
			{ id: 'a', points: [pt(0, 0), tip], allowance: 5 },
			{ id: 'b', points: [tip, foot], allowance: 5 },
			{ id: 'c', points: [foot, pt(0, 0)], allowance: 5 }
		];
		const cut = cutOutline(sharp);
		// A mitre would reach 5 / sin 5° ≈ 57 mm past the point; the bevel stays within the allowance of it.
		const far = Math.max(...cut.filter((p) => p.x > 150).map((p) => Math.hypot(p.x - tip.x, p.y - tip.y)));
		expect(far).toBeLessThan(5 + 1e-9);
		expect(Math.max(...cut.map((p) => p.x))).toBeGreaterThan(tip.x);
	});
});

describe('pathLength and cubicCurve', () => {
	it('measures a 3-4-5 polyline as 12', () => {
		const points: Point[] = [pt(0, 0), pt(3, 0), pt(3, 4), pt(0, 0)];
		expect(pathLength(points)).toBe(12);
	});
	it('draws a straight cubic as its chord and ends on its end point', () => {
		const line = cubicCurve(pt(0, 0), pt(10, 0), pt(20, 0), pt(30, 0));
		expect(line.at(-1)).toEqual(pt(30, 0));
		expect(pathLength([pt(0, 0), ...line])).toBeCloseTo(30, 9);
	});
});
