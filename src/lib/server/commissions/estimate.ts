import { draftGarmentMm, garments, type GarmentId, type Measurements, type Unit } from '$lib/drafting';
import type { SizeBandRange } from '$lib/format/size-band';

/*
 * A whole body to draft from when only the size band is known: bust, waist and hip are the EN 13402-3
 * pictogram body 88-72-96, the other values mid-range adult figures (from memory). The band's girths
 * replace the matching ones at the middle of each band.
 */
const referenceBodyMm: Measurements = {
	stature: 1680,
	neck_girth: 350,
	bust_girth: 880,
	under_bust_girth: 730,
	waist_girth: 720,
	hip_girth: 960,
	thigh_girth: 560,
	knee_girth: 370,
	ankle_girth: 230,
	upper_arm_girth: 280,
	wrist_girth: 160,
	shoulder_width: 380,
	across_back: 340,
	nape_to_waist: 410,
	shoulder_to_bust_point: 250,
	bust_point_span: 180,
	waist_to_hip: 206,
	body_rise: 280,
	inside_leg: 780,
	waist_to_floor: 1040,
	arm_length: 580
};

/** The draft's cloth and lining layouts for the middle of the size band, at the default width. */
function bandFabric(garmentType: string, band: readonly SizeBandRange[], unit: Unit) {
	if (!garments.some((g) => g.id === garmentType) || band.length === 0) return null;
	const body: Measurements = { ...referenceBodyMm };
	for (const d of band) (body as Record<string, number>)[d.dimension] = Math.round((d.lowerMm + d.upperMm) / 2);
	return draftGarmentMm({ garment: garmentType as GarmentId, unit, bodyMm: body, unitConfirmed: true }).fabric;
}

/** The fabric a garment of this size band takes, at the default width, as the reader's unit writes it. */
export function fabricEstimateForBand(garmentType: string, band: readonly SizeBandRange[], unit: Unit) {
	const fabric = bandFabric(garmentType, band, unit);
	if (!fabric) return null;
	return { length: fabric.lengthDisplay, width: fabric.width, unit, folded: fabric.folded };
}

/**
 * A lined garment's lining for the size band: its own layout on lining as wide as the cloth. Null for an
 * unlined garment; `length` null when a lining piece is wider than the lining.
 */
export function liningEstimateForBand(garmentType: string, band: readonly SizeBandRange[], unit: Unit) {
	const lining = bandFabric(garmentType, band, unit)?.lining;
	if (!lining) return null;
	return { length: lining.fits ? lining.lengthDisplay : null, pieces: lining.pieces, width: lining.width, unit };
}
