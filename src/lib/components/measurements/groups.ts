import type { MeasurementCode } from '$lib/drafting';

export type MeasurementGroup = { id: string; title: string; codes: readonly MeasurementCode[] };

/** The vocabulary in the order a tape goes round a body: height and girths, then the upper body, arms, legs. */
export const measurementGroups: readonly MeasurementGroup[] = [
	{
		id: 'girths',
		title: 'Height and round the body',
		codes: ['stature', 'neck_girth', 'bust_girth', 'under_bust_girth', 'waist_girth', 'hip_girth']
	},
	{
		id: 'upper-body',
		title: 'Shoulders, back and bust',
		codes: ['shoulder_width', 'across_back', 'nape_to_waist', 'shoulder_to_bust_point', 'bust_point_span']
	},
	{ id: 'arms', title: 'Arms', codes: ['upper_arm_girth', 'wrist_girth', 'arm_length'] },
	{
		id: 'legs',
		title: 'Waist down',
		codes: ['waist_to_hip', 'body_rise', 'inside_leg', 'waist_to_floor', 'thigh_girth', 'knee_girth', 'ankle_girth']
	}
];
