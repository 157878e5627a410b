import type { Point } from '../geometry';
import type { Measurements } from '../measurements';
import { resolveOptions } from '../options';
import type { TemplateDraft } from '../pieces';
import { fromMm, toMm, type Unit } from '../units';
import type { GarmentTemplate, OptionValue } from './types';

/** Drafts with measurements and length options given in `unit`, for tests. */
export function draftIn(
	template: GarmentTemplate,
	unit: Unit,
	measurements: Measurements,
	options: Record<string, OptionValue> = {}
): TemplateDraft & { line: (id: string) => number } {
	const body = Object.fromEntries(Object.entries(measurements).map(([code, value]) => [code, toMm(value, unit)]));
	const lengthIds = new Set(template.options.filter((o) => o.kind === 'length').map((o) => o.id));
	const given = Object.fromEntries(
		Object.entries(options).map(([id, value]) => [
			id,
			lengthIds.has(id) && typeof value === 'number' ? toMm(value, unit) : value
		])
	);
	const resolved = resolveOptions(template, given, body, unit);
	if (resolved.errors.length) throw new Error(resolved.errors.map((e) => e.message).join('; '));
	const draft = template.draft(body, resolved.options);
	const line = (qualified: string) => {
		const [pieceId, lineId] = qualified.split('.');
		const found = draft.pieces.find((p) => p.id === pieceId)?.lines.find((l) => l.id === lineId);
		if (!found) throw new Error(`No line ${qualified}`);
		return fromMm(found.mm, unit);
	};
	return { ...draft, line };
}

/**
 * A whole body in cm: bust, waist and hip are the EN 13402-3 pictogram body 88-72-96; the other values are
 * mid-range adult figures from memory, chosen to agree with each other.
 */
export const standardBodyCm = {
	stature: 168,
	neck_girth: 35,
	bust_girth: 88,
	under_bust_girth: 73,
	waist_girth: 72,
	hip_girth: 96,
	thigh_girth: 56,
	knee_girth: 37,
	ankle_girth: 23,
	upper_arm_girth: 28,
	wrist_girth: 16,
	shoulder_width: 38,
	across_back: 34,
	nape_to_waist: 41,
	shoulder_to_bust_point: 25,
	bust_point_span: 18,
	waist_to_hip: 20.6,
	body_rise: 28,
	inside_leg: 78,
	waist_to_floor: 104,
	arm_length: 58
} as const;

/** Distance from a point to the nearest edge of a closed outline. */
export function distanceToOutline(p: Point, outline: readonly Point[]): number {
	let best = Infinity;
	outline.forEach((a, i) => {
		const b = outline[(i + 1) % outline.length];
		const length2 = (b.x - a.x) ** 2 + (b.y - a.y) ** 2;
		const t = length2 ? Math.min(1, Math.max(0, ((p.x - a.x) * (b.x - a.x) + (p.y - a.y) * (b.y - a.y)) / length2)) : 0;
		best = Math.min(best, Math.hypot(p.x - (a.x + t * (b.x - a.x)), p.y - (a.y + t * (b.y - a.y))));
	});
	return best;
}

/** Where a closed outline crosses the horizontal line at `y`: its least and greatest x there. */
export function spanAt(outline: readonly Point[], y: number): { min: number; max: number } {
	const xs: number[] = [];
	outline.forEach((a, i) => {
		const b = outline[(i + 1) % outline.length];
		if (a.y <= y !== b.y <= y) xs.push(a.x + ((y - a.y) * (b.x - a.x)) / (b.y - a.y));
	});
	return { min: Math.min(...xs), max: Math.max(...xs) };
}

/**
 * Points along an edge at least `clear` mm from both of its ends and from any sharp turn in it (more than
 * 10°): at corners the allowances are mitred, so the cutting line lies further out there, not at the allowance.
 */
export function sampleAlong(points: readonly Point[], clear: number, step = 5): Point[] {
	const along: number[] = [0];
	for (let i = 1; i < points.length; i++)
		along.push(along[i - 1] + Math.hypot(points[i].x - points[i - 1].x, points[i].y - points[i - 1].y));
	const total = along[along.length - 1];
	const corners = [0, total];
	for (let i = 1; i < points.length - 1; i++) {
		const a = Math.atan2(points[i].y - points[i - 1].y, points[i].x - points[i - 1].x);
		const b = Math.atan2(points[i + 1].y - points[i].y, points[i + 1].x - points[i].x);
		const turn = Math.abs(((b - a + 3 * Math.PI) % (2 * Math.PI)) - Math.PI);
		if (turn > Math.PI / 18) corners.push(along[i]);
	}
	const samples: Point[] = [];
	for (let i = 1; i < points.length; i++) {
		const a = points[i - 1];
		const b = points[i];
		const length = along[i] - along[i - 1];
		for (let d = 0; d < length; d += step) {
			if (corners.some((c) => Math.abs(along[i - 1] + d - c) < clear)) continue;
			samples.push({ x: a.x + ((b.x - a.x) * d) / length, y: a.y + ((b.y - a.y) * d) / length });
		}
	}
	return samples;
}

/** Template options resolved for a body given in cm, as the draft would use them (lengths in mm). */
export function resolvedFor(
	template: GarmentTemplate,
	bodyCm: Measurements,
	options: Record<string, OptionValue> = {}
) {
	const body = Object.fromEntries(Object.entries(bodyCm).map(([code, value]) => [code, toMm(value, 'cm')]));
	const resolved = resolveOptions(template, options, body, 'cm');
	if (resolved.errors.length) throw new Error(resolved.errors.map((e) => e.message).join('; '));
	return { body, options: resolved.options };
}
