import type { MeasurementValuesMm, NewMeasurementProfile } from '../../src/lib/server/db/schema';
import { demoId } from './ids';
import { personId } from './people';
import { daysFrom } from './time';

const rosalind: MeasurementValuesMm = {
	stature: 1650,
	neck_girth: 345,
	bust_girth: 920,
	under_bust_girth: 780,
	waist_girth: 740,
	hip_girth: 1000,
	thigh_girth: 580,
	knee_girth: 370,
	ankle_girth: 230,
	upper_arm_girth: 285,
	wrist_girth: 155,
	shoulder_width: 385,
	across_back: 350,
	nape_to_waist: 405,
	shoulder_to_bust_point: 255,
	bust_point_span: 185,
	waist_to_hip: 205,
	body_rise: 275,
	inside_leg: 760,
	waist_to_floor: 1040,
	arm_length: 585
};

// A fourteen-year-old: no bust measurements, and still growing.
const rosalindsSon: MeasurementValuesMm = {
	stature: 1640,
	neck_girth: 335,
	bust_girth: 820,
	waist_girth: 690,
	hip_girth: 850,
	thigh_girth: 500,
	knee_girth: 350,
	ankle_girth: 225,
	upper_arm_girth: 245,
	wrist_girth: 160,
	shoulder_width: 400,
	across_back: 360,
	nape_to_waist: 420,
	waist_to_hip: 190,
	body_rise: 250,
	inside_leg: 770,
	waist_to_floor: 1010,
	arm_length: 590
};

const tamsin: MeasurementValuesMm = {
	stature: 1700,
	neck_girth: 360,
	bust_girth: 1010,
	under_bust_girth: 860,
	waist_girth: 860,
	hip_girth: 1080,
	thigh_girth: 630,
	knee_girth: 400,
	ankle_girth: 245,
	upper_arm_girth: 315,
	wrist_girth: 165,
	shoulder_width: 400,
	across_back: 370,
	nape_to_waist: 420,
	shoulder_to_bust_point: 275,
	bust_point_span: 200,
	waist_to_hip: 210,
	body_rise: 290,
	inside_leg: 790,
	waist_to_floor: 1075,
	arm_length: 600
};

const felix: MeasurementValuesMm = {
	stature: 1800,
	neck_girth: 400,
	bust_girth: 1000,
	waist_girth: 860,
	hip_girth: 990,
	thigh_girth: 590,
	knee_girth: 395,
	ankle_girth: 250,
	upper_arm_girth: 320,
	wrist_girth: 175,
	shoulder_width: 460,
	across_back: 400,
	nape_to_waist: 450,
	waist_to_hip: 200,
	body_rise: 280,
	inside_leg: 830,
	waist_to_floor: 1100,
	arm_length: 640
};

const nadia: MeasurementValuesMm = {
	stature: 1580,
	neck_girth: 325,
	bust_girth: 860,
	under_bust_girth: 730,
	waist_girth: 680,
	hip_girth: 930,
	thigh_girth: 540,
	knee_girth: 355,
	ankle_girth: 215,
	upper_arm_girth: 260,
	wrist_girth: 148,
	shoulder_width: 370,
	across_back: 335,
	nape_to_waist: 390,
	shoulder_to_bust_point: 240,
	bust_point_span: 175,
	waist_to_hip: 195,
	body_rise: 265,
	inside_leg: 720,
	waist_to_floor: 990,
	arm_length: 560
};

type DemoProfile = Pick<NewMeasurementProfile, 'label' | 'unit' | 'valuesMm' | 'takenBy' | 'notes'> & {
	n: number;
	owner: string;
	takenDaysAgo: number;
};

const profiles = {
	rosalind: {
		n: 1,
		owner: 'customer@tackline.test',
		label: 'Me',
		valuesMm: rosalind,
		takenBy: 'companion',
		takenDaysAgo: 20
	},
	rosalindsSon: {
		n: 2,
		owner: 'customer@tackline.test',
		label: 'My son',
		valuesMm: rosalindsSon,
		takenBy: 'companion',
		takenDaysAgo: 6,
		notes: 'Measured over a T-shirt. Growing fast: leave hems and side seams generous.'
	},
	tamsin: {
		n: 3,
		owner: 'tamsin.oyelaran@tackline.test',
		label: 'Me',
		valuesMm: tamsin,
		takenBy: 'tailor',
		takenDaysAgo: 40
	},
	felix: {
		n: 4,
		owner: 'felix.garrow@tackline.test',
		label: 'Me',
		unit: 'in',
		valuesMm: felix,
		takenBy: 'self',
		takenDaysAgo: 12
	},
	nadia: {
		n: 5,
		owner: 'nadia.kestrel@tackline.test',
		label: 'Me',
		valuesMm: nadia,
		takenBy: 'companion',
		takenDaysAgo: 9
	}
} satisfies Record<string, DemoProfile>;

export type ProfileKey = keyof typeof profiles;
type DemoProfileRow = NewMeasurementProfile & Required<Pick<NewMeasurementProfile, 'id' | 'takenBy' | 'takenAt'>>;

export function demoMeasurementProfiles(now: Date): Record<ProfileKey, DemoProfileRow> {
	const rows = Object.entries(profiles).map(([key, { n, owner, takenDaysAgo, ...rest }]) => [
		key,
		{
			...rest,
			id: demoId('measurementProfile', n),
			ownerId: personId(owner),
			takenAt: daysFrom(now, -takenDaysAgo)
		}
	]) satisfies [string, DemoProfileRow][];
	return Object.fromEntries(rows) as Record<ProfileKey, DemoProfileRow>;
}
