/**
 * The body measurements Tackline stores, keyed by these codes, in millimetres.
 * Names follow ISO 8559-1 terms where one exists.
 */
export const measurementCodes = [
	'stature',
	'neck_girth',
	'bust_girth',
	'under_bust_girth',
	'waist_girth',
	'hip_girth',
	'thigh_girth',
	'knee_girth',
	'ankle_girth',
	'upper_arm_girth',
	'wrist_girth',
	'shoulder_width',
	'across_back',
	'nape_to_waist',
	'shoulder_to_bust_point',
	'bust_point_span',
	'waist_to_hip',
	'body_rise',
	'inside_leg',
	'waist_to_floor',
	'arm_length'
] as const;

export type MeasurementCode = (typeof measurementCodes)[number];
export type Measurements = Partial<Record<MeasurementCode, number>>;

export const garmentIds = [
	'wide-leg-trousers',
	'cropped-top',
	'straight-skirt',
	'a-line-skirt',
	'shift-dress',
	'tunic',
	'shirt',
	'waistcoat'
] as const;
export type GarmentId = (typeof garmentIds)[number];

export type RangeSource = 'ansur-nhanes' | 'ansur' | 'from-memory';

export interface MeasurementInfo {
	code: MeasurementCode;
	label: string;
	kind: 'girth' | 'length' | 'width';
	howTo: string;
	/** Soft range in mm: outside it we ask the person to check the value. */
	typical: readonly [number, number];
	/** Outside this range the value is almost certainly a typo. */
	limits: readonly [number, number];
	rangeSource: RangeSource;
	garments: readonly GarmentId[];
}

/*
 * Ranges. "ansur-nhanes": typical = [p1, p99] over the union of ANSUR II (2012 US Army survey, women and men,
 * NATICK/TR-15/007) and NHANES 2017–Mar 2020 adults; limits = [0.8 × sample minimum, 1.2 × sample maximum].
 * "ansur": the same from ANSUR II alone (a fit military sample, so civilian tails are wider).
 * "from-memory": no dataset at hand; wide ranges from general tailoring knowledge.
 */
const vocabulary: MeasurementInfo[] = [
	{
		code: 'stature',
		label: 'Height',
		kind: 'length',
		howTo:
			'Stand straight against a wall without shoes, heels together. Measure from the floor to the top of the head.',
		typical: [1439, 1927],
		limits: [1049, 2395],
		rangeSource: 'ansur-nhanes',
		garments: []
	},
	{
		code: 'neck_girth',
		label: 'Neck',
		kind: 'girth',
		howTo:
			'Round the neck about 2 cm below the Adam’s apple, level with the knobbly bone at the back of the neck. One finger under the tape.',
		typical: [291, 467],
		limits: [220, 617],
		rangeSource: 'ansur',
		garments: ['shirt', 'waistcoat']
	},
	{
		code: 'bust_girth',
		label: 'Bust / chest',
		kind: 'girth',
		howTo:
			'Round the fullest part of the chest, under the arms and across the shoulder blades, tape level, breathing normally.',
		typical: [784, 1276],
		limits: [556, 1763],
		rangeSource: 'ansur',
		garments: ['cropped-top', 'shift-dress', 'tunic', 'shirt', 'waistcoat']
	},
	{
		code: 'under_bust_girth',
		label: 'Under bust',
		kind: 'girth',
		howTo: 'Round the ribcage just below the bust, tape level and snug.',
		typical: [620, 1250],
		limits: [500, 1500],
		rangeSource: 'from-memory',
		garments: ['shift-dress', 'shirt']
	},
	{
		code: 'waist_girth',
		label: 'Waist',
		kind: 'girth',
		howTo:
			'Round the natural waist, the narrowest part between the ribs and the hip bones. For high-waisted trousers, measure where the waistband will sit.',
		typical: [665, 1465],
		limits: [451, 2136],
		rangeSource: 'ansur-nhanes',
		garments: ['wide-leg-trousers', 'straight-skirt', 'a-line-skirt', 'shift-dress', 'shirt', 'waistcoat']
	},
	{
		code: 'hip_girth',
		label: 'Hip',
		kind: 'girth',
		howTo: 'Stand with feet together. Measure round the fullest part of the seat, tape level all the way round.',
		typical: [830, 1546],
		limits: [590, 2148],
		rangeSource: 'ansur-nhanes',
		garments: ['wide-leg-trousers', 'straight-skirt', 'a-line-skirt', 'shift-dress', 'tunic', 'shirt', 'waistcoat']
	},
	{
		code: 'thigh_girth',
		label: 'Thigh',
		kind: 'girth',
		howTo: 'Round the fullest part of one thigh, just below the crotch, standing with weight on both feet.',
		typical: [495, 774],
		limits: [330, 1044],
		rangeSource: 'ansur',
		garments: ['wide-leg-trousers']
	},
	{
		code: 'knee_girth',
		label: 'Knee',
		kind: 'girth',
		howTo: 'Round the knee with the leg straight, over the kneecap.',
		typical: [300, 500],
		limits: [220, 650],
		rangeSource: 'from-memory',
		garments: []
	},
	{
		code: 'ankle_girth',
		label: 'Ankle',
		kind: 'girth',
		howTo: 'Round the narrowest part of the leg just above the ankle bone.',
		typical: [190, 300],
		limits: [150, 400],
		rangeSource: 'from-memory',
		garments: []
	},
	{
		code: 'upper_arm_girth',
		label: 'Upper arm',
		kind: 'girth',
		howTo: 'Round the fullest part of the upper arm, arm relaxed by the side.',
		typical: [220, 450],
		limits: [160, 600],
		rangeSource: 'from-memory',
		garments: ['tunic', 'shirt']
	},
	{
		code: 'wrist_girth',
		label: 'Wrist',
		kind: 'girth',
		howTo: 'Round the wrist just above the wrist bone.',
		typical: [130, 200],
		limits: [100, 260],
		rangeSource: 'from-memory',
		garments: []
	},
	{
		code: 'shoulder_width',
		label: 'Shoulder width',
		kind: 'width',
		howTo: 'Across the back from the tip of one shoulder bone to the other, following the curve of the back.',
		typical: [322, 463],
		limits: [226, 587],
		rangeSource: 'ansur',
		garments: ['cropped-top', 'shift-dress', 'tunic', 'shirt', 'waistcoat']
	},
	{
		code: 'across_back',
		label: 'Across back',
		kind: 'width',
		howTo: 'Across the shoulder blades, halfway between the neck and the armpit, from one arm crease to the other.',
		typical: [290, 440],
		limits: [220, 540],
		rangeSource: 'from-memory',
		garments: []
	},
	{
		code: 'nape_to_waist',
		label: 'Nape to waist',
		kind: 'length',
		howTo: 'Down the centre back from the knobbly bone at the base of the neck to the natural waist.',
		typical: [350, 490],
		limits: [280, 580],
		rangeSource: 'from-memory',
		garments: ['shift-dress', 'shirt', 'waistcoat']
	},
	{
		code: 'shoulder_to_bust_point',
		label: 'Shoulder to bust point',
		kind: 'length',
		howTo: 'From where the shoulder meets the neck, straight down over the chest to the fullest point of the bust.',
		typical: [200, 330],
		limits: [150, 400],
		rangeSource: 'from-memory',
		garments: ['cropped-top', 'shift-dress', 'shirt']
	},
	{
		code: 'bust_point_span',
		label: 'Bust point span',
		kind: 'width',
		howTo: 'Straight across from one bust point to the other.',
		typical: [140, 240],
		limits: [100, 300],
		rangeSource: 'from-memory',
		garments: ['cropped-top', 'shift-dress', 'shirt']
	},
	{
		code: 'waist_to_hip',
		label: 'Waist to hip',
		kind: 'length',
		howTo: 'Down the side from the natural waist to the level of the fullest part of the hip.',
		typical: [150, 280],
		limits: [100, 350],
		rangeSource: 'from-memory',
		garments: ['straight-skirt', 'a-line-skirt', 'shift-dress', 'shirt', 'waistcoat']
	},
	{
		code: 'body_rise',
		label: 'Body rise',
		kind: 'length',
		howTo: 'Sit straight on a hard, flat chair. Measure down the side from the waist to the seat of the chair.',
		typical: [200, 380],
		limits: [120, 500],
		rangeSource: 'from-memory',
		garments: []
	},
	{
		code: 'inside_leg',
		label: 'Inside leg',
		kind: 'length',
		howTo: 'Without shoes, feet slightly apart: from the crotch straight down the inside of the leg to the floor.',
		typical: [685, 960],
		limits: [488, 1237],
		rangeSource: 'ansur',
		garments: []
	},
	{
		code: 'waist_to_floor',
		label: 'Waist to floor',
		kind: 'length',
		howTo: 'Without shoes: down the side from the waist (where the waistband will sit) to the floor.',
		typical: [869, 1186],
		limits: [644, 1494],
		rangeSource: 'ansur',
		garments: ['wide-leg-trousers']
	},
	{
		code: 'arm_length',
		label: 'Arm length',
		kind: 'length',
		howTo: 'From the tip of the shoulder bone over the slightly bent elbow to the wrist bone.',
		typical: [478, 670],
		limits: [328, 851],
		rangeSource: 'ansur',
		garments: ['tunic', 'shirt']
	}
];

export const measurementInfo: Readonly<Record<MeasurementCode, MeasurementInfo>> = Object.fromEntries(
	vocabulary.map((info) => [info.code, info])
) as Record<MeasurementCode, MeasurementInfo>;

export function isMeasurementCode(value: string): value is MeasurementCode {
	return (measurementCodes as readonly string[]).includes(value);
}
