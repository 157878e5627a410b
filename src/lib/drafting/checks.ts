import { measurementInfo, type MeasurementCode, type Measurements } from './measurements';
import { formatLength, type Unit } from './units';

export type FindingCode =
	| 'not_positive'
	| 'out_of_range'
	| 'likely_typo'
	| 'unit_mixup'
	| 'unusual_relation'
	| 'impossible_relation'
	| 'missing_measurements'
	| 'option_out_of_range'
	| 'fabric_too_narrow';

/** A warning (never blocks) or an error (blocks drafting), naming the fields it is about. */
export interface Finding {
	code: FindingCode;
	fields: string[];
	message: string;
	/** For a unit mix-up: the unit the numbers look like they were typed in, when Tackline offers it. */
	suggestedUnit?: Unit;
}

/** How the checks read the body. */
export interface CheckContext {
	/** The person has said the numbers are in the unit given; mix-ups then only warn. */
	unitConfirmed?: boolean;
}

/** Below the adult p1 of NHANES 2017–2020 (143.9 cm): likely a child (EN 14682 covers children up to 14). */
export const childStatureMm = 1400;
/** Shorter than a newborn (about 50 cm, WHO child growth standards): not a height at all. */
const minStatureMm = 450;

/** A height that reads as a child's in the unit given, so small girths are a child's and not a unit mix-up. */
export function isChildBody(m: Measurements): boolean {
	return m.stature !== undefined && m.stature >= minStatureMm && m.stature < childStatureMm;
}

export interface CheckResult {
	warnings: Finding[];
	errors: Finding[];
}

const show = (mm: number, unit: Unit) => formatLength(mm, unit, { withUnit: true });
const label = (code: MeasurementCode) => measurementInfo[code].label;

/** What the typed number would be in millimetres had the person used another unit. */
function mixUpCandidates(mm: number, unit: Unit) {
	if (unit === 'in') {
		return [
			{ intendedMm: mm / 2.54, typedAs: 'centimetres typed into an inch field', unit: 'cm' as const },
			{ intendedMm: mm / 25.4, typedAs: 'millimetres typed into an inch field', unit: undefined }
		];
	}
	return [
		{ intendedMm: mm * 2.54, typedAs: 'inches typed into a centimetre field', unit: 'in' as const },
		{ intendedMm: mm / 10, typedAs: 'millimetres typed into a centimetre field', unit: undefined },
		{ intendedMm: mm * 100, typedAs: 'metres typed into a centimetre field', unit: undefined }
	];
}

export function checkValue(code: MeasurementCode, mm: number, unit: Unit, child = false): Finding | null {
	const info = measurementInfo[code];
	if (!(mm > 0)) {
		return { code: 'not_positive', fields: [code], message: `${info.label} must be more than zero.` };
	}
	const [low, high] = info.typical;
	if (mm >= low && mm <= high) return null;
	const range = `${formatLength(low, unit)}–${show(high, unit)}`;
	const typed = show(mm, unit);
	const [floor, ceiling] = info.limits;
	if (child && mm < low && mm <= ceiling) {
		return {
			code: 'out_of_range',
			fields: [code],
			message: `${info.label} ${typed} is below the usual adult range (${range}), as expected for a child.`
		};
	}
	const mixUp = mixUpCandidates(mm, unit).find((c) => c.intendedMm >= low && c.intendedMm <= high);
	if (mixUp) {
		return {
			code: 'unit_mixup',
			fields: [code],
			message: `${info.label} ${typed} looks like ${mixUp.typedAs}; the usual adult range is ${range}.`,
			...(mixUp.unit ? { suggestedUnit: mixUp.unit } : {})
		};
	}
	if (mm < floor || mm > ceiling) {
		return {
			code: 'likely_typo',
			fields: [code],
			message: `${info.label} ${typed} cannot be right: it is far outside any human range (usual adult range ${range}). Please correct it.`
		};
	}
	return {
		code: 'out_of_range',
		fields: [code],
		message: `${info.label} ${typed} is outside the usual adult range (${range}). Fine if that is right.`
	};
}

type Both = (a: number, b: number) => boolean;

interface Relation {
	a: MeasurementCode;
	b: MeasurementCode;
	violated: Both;
	severity: 'warning' | 'error';
	describe: (a: string, b: string) => string;
}

/*
 * Impossible relations follow from the definitions (EN 13402-1 / ISO 8559-1: bust is the maximum girth of the
 * chest; inside leg ends at the crotch, below the waist). Unusual thresholds widen ANSUR II (2012) ratios
 * (waist/hip p5–p95 0.749–1.020 women to men; crotch height/stature 0.456–0.506) — common practice margins.
 */
const relations: Relation[] = [
	rel(
		'inside_leg',
		'waist_to_floor',
		(a, b) => a >= b,
		'error',
		(a, b) => `Inside leg (${a}) must be shorter than waist to floor (${b}).`
	),
	rel(
		'waist_to_floor',
		'stature',
		(a, b) => a >= b,
		'error',
		(a, b) => `Waist to floor (${a}) must be less than height (${b}).`
	),
	rel(
		'inside_leg',
		'stature',
		(a, b) => a >= b,
		'error',
		(a, b) => `Inside leg (${a}) must be less than height (${b}).`
	),
	rel(
		'arm_length',
		'stature',
		(a, b) => a >= b,
		'error',
		(a, b) => `Arm length (${a}) must be less than height (${b}).`
	),
	rel(
		'body_rise',
		'waist_to_floor',
		(a, b) => a >= b,
		'error',
		(a, b) => `Body rise (${a}) must be less than waist to floor (${b}).`
	),
	rel(
		'waist_to_hip',
		'waist_to_floor',
		(a, b) => a >= b,
		'error',
		(a, b) => `Waist to hip (${a}) must be less than waist to floor (${b}).`
	),
	rel(
		'under_bust_girth',
		'bust_girth',
		(a, b) => a > b,
		'error',
		(a, b) => `Under bust (${a}) cannot be more than the bust (${b}), which is the fullest girth of the chest.`
	),
	rel(
		'bust_point_span',
		'bust_girth',
		(a, b) => a >= b / 2,
		'error',
		(a, b) => `Bust point span (${a}) must be less than half the bust (${b}).`
	),
	rel(
		'thigh_girth',
		'hip_girth',
		(a, b) => a >= b,
		'error',
		(a, b) => `One thigh (${a}) cannot be as big as the hip round both legs (${b}).`
	),
	rel(
		'neck_girth',
		'bust_girth',
		(a, b) => a >= b,
		'error',
		(a, b) => `Neck (${a}) must be less than the bust (${b}).`
	),
	rel(
		'waist_girth',
		'hip_girth',
		(a, b) => a / b > 1.25,
		'warning',
		(a, b) => `Waist (${a}) is much larger than hip (${b}); please check both.`
	),
	rel(
		'waist_girth',
		'hip_girth',
		(a, b) => a / b < 0.6,
		'warning',
		(a, b) => `Waist (${a}) is much smaller than hip (${b}); please check both.`
	),
	rel(
		'inside_leg',
		'stature',
		(a, b) => a / b < 0.4 || a / b > 0.56,
		'warning',
		(a, b) => `Inside leg (${a}) is an unusual share of height (${b}); please check both.`
	),
	rel(
		'shoulder_width',
		'bust_girth',
		(a, b) => a / b > 0.6 || a / b < 0.25,
		'warning',
		(a, b) =>
			`Shoulder width (${a}) is unusual for a bust of ${b}; measure across the back from shoulder tip to shoulder tip.`
	),
	rel(
		'across_back',
		'shoulder_width',
		(a, b) => a > b,
		'warning',
		(a, b) => `Across back (${a}) is usually less than shoulder width (${b}).`
	),
	rel(
		'under_bust_girth',
		'bust_girth',
		(a, b) => b - a > 400,
		'warning',
		(a, b) => `Bust (${b}) is unusually far above under bust (${a}); please check both.`
	),
	rel(
		'wrist_girth',
		'upper_arm_girth',
		(a, b) => a >= b,
		'warning',
		(a, b) => `Wrist (${a}) is usually smaller than upper arm (${b}).`
	),
	rel(
		'knee_girth',
		'thigh_girth',
		(a, b) => a >= b,
		'warning',
		(a, b) => `Knee (${a}) is usually smaller than thigh (${b}).`
	),
	rel(
		'ankle_girth',
		'knee_girth',
		(a, b) => a >= b,
		'warning',
		(a, b) => `Ankle (${a}) is usually smaller than knee (${b}).`
	),
	rel(
		'shoulder_to_bust_point',
		'nape_to_waist',
		(a, b) => a >= b,
		'warning',
		(a, b) => `Shoulder to bust point (${a}) is usually shorter than nape to waist (${b}).`
	)
];

function rel(
	a: MeasurementCode,
	b: MeasurementCode,
	violated: Both,
	severity: 'warning' | 'error',
	describe: Relation['describe']
): Relation {
	return { a, b, violated, severity, describe };
}

/** Tailoring practice: body rise ≈ outside leg − inside leg; larger gaps usually mean a slipped tape. */
const riseTolerance = 60;

export function checkRelations(m: Measurements, unit: Unit): CheckResult {
	const result: CheckResult = { warnings: [], errors: [] };
	for (const relation of relations) {
		const a = m[relation.a];
		const b = m[relation.b];
		if (a === undefined || b === undefined || !relation.violated(a, b)) continue;
		const finding: Finding = {
			code: relation.severity === 'error' ? 'impossible_relation' : 'unusual_relation',
			fields: [relation.a, relation.b],
			message: relation.describe(show(a, unit), show(b, unit))
		};
		(relation.severity === 'error' ? result.errors : result.warnings).push(finding);
	}
	const { body_rise: rise, waist_to_floor: outside, inside_leg: inside } = m;
	if (rise !== undefined && outside !== undefined && inside !== undefined && outside > inside) {
		const standingRise = outside - inside;
		if (Math.abs(rise - standingRise) > riseTolerance) {
			result.warnings.push({
				code: 'unusual_relation',
				fields: ['body_rise', 'waist_to_floor', 'inside_leg'],
				message: `Body rise (${show(rise, unit)}) is usually close to waist to floor minus inside leg (${show(standingRise, unit)}); please check the three.`
			});
		}
	}
	return result;
}

export function checkMissing(m: Measurements, required: readonly MeasurementCode[]): Finding | null {
	const missing = required.filter((code) => m[code] === undefined);
	if (missing.length === 0) return null;
	return {
		code: 'missing_measurements',
		fields: missing,
		message: `This garment needs: ${missing.map(label).join(', ')}.`
	};
}

/** Findings that stop a draft: a value no body has, or a unit mix-up the person has not answered. */
function blocks(finding: Finding, context: CheckContext): boolean {
	if (finding.code === 'unit_mixup') return !context.unitConfirmed;
	return finding.code === 'not_positive' || finding.code === 'likely_typo';
}

/** Every check on a set of measurements (in mm), with messages in the person's unit. */
export function checkMeasurements(
	m: Measurements,
	unit: Unit,
	required: readonly MeasurementCode[] = [],
	context: CheckContext = {}
): CheckResult {
	const result: CheckResult = { warnings: [], errors: [] };
	const child = isChildBody(m);
	for (const [code, mm] of Object.entries(m) as Array<[MeasurementCode, number]>) {
		const finding = checkValue(code, mm, unit, child);
		if (!finding) continue;
		(blocks(finding, context) ? result.errors : result.warnings).push(finding);
	}
	const missing = checkMissing(m, required);
	if (missing) result.errors.push(missing);
	const related = checkRelations(m, unit);
	result.warnings.push(...related.warnings);
	result.errors.push(...related.errors);
	return result;
}
