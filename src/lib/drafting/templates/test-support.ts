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
