import type { MeasurementSnapshot, NewCommission } from '../../src/lib/server/db/schema';
import { city, coarse, currency, districts, type DistrictKey } from './city';
import { demoId } from './ids';
import type { demoMeasurementProfiles, ProfileKey } from './measurements';
import { personId } from './people';
import { dateFrom, daysFrom } from './time';

type Profiles = ReturnType<typeof demoMeasurementProfiles>;

type DemoCommission = Pick<
	NewCommission,
	'garmentType' | 'title' | 'styleNotes' | 'sizeBand' | 'fabricSource' | 'fabricNotes' | 'handover'
> & {
	n: number;
	customer: string;
	profile: ProfileKey;
	district: DistrictKey;
	budget: [min: number, max: number];
	neededInDays: number;
	/** Absent for a draft. */
	postedDaysAgo?: number;
};

const demoCommissionList: DemoCommission[] = [
	{
		n: 1,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'wide-leg-trousers',
		title: 'High-waisted wide-leg trousers in washed linen',
		styleNotes:
			'Sitting at the natural waist, two front pleats, side-seam pockets and a flat waistband with a concealed side zip. Full length, just brushing the floor in flat shoes.',
		sizeBand: 'waist 72–76 cm, hip 98–102 cm',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Mid-weight washed linen in sand or olive, no stretch.',
		budget: [12000, 18000],
		neededInDays: 45,
		handover: 'pickup',
		postedDaysAgo: 3
	},
	{
		n: 2,
		customer: 'customer@tackline.test',
		profile: 'rosalindsSon',
		district: 'oldQuay',
		garmentType: 'tunic',
		title: 'Concert tunic for my son',
		styleNotes:
			'Plain hip-length tunic with long sleeves and a low stand collar for a school concert. It closes with a short button placket at the neck: no drawstring or cord at the neck or hem, please. He is fourteen.',
		sizeBand: 'chest 80–84 cm, hip 84–88 cm',
		fabricSource: 'customer_supplies',
		fabricNotes: '2 m of navy cotton drill, 150 cm wide, already washed.',
		budget: [6000, 9000],
		neededInDays: 30,
		handover: 'pickup',
		postedDaysAgo: 1
	},
	{
		n: 3,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'straight-skirt',
		title: 'Straight skirt for work',
		styleNotes: 'Knee length with a back vent. Still deciding on the fabric.',
		sizeBand: null,
		fabricSource: 'tailor_sources',
		fabricNotes: '',
		budget: [8000, 12000],
		neededInDays: 60,
		handover: 'pickup'
	},
	{
		n: 4,
		customer: 'tamsin.oyelaran@tackline.test',
		profile: 'tamsin',
		district: 'brightwater',
		garmentType: 'shift-dress',
		title: 'Sleeveless shift dress for a summer wedding',
		styleNotes:
			'Bateau neckline, darted bodice, hem just below the knee. Fully lined, invisible zip at the centre back.',
		sizeBand: 'bust 100–104 cm, hip 106–110 cm',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Silk-cotton voile in a deep teal or marigold; lining in cotton lawn.',
		budget: [20000, 32000],
		neededInDays: 60,
		handover: 'delivery',
		postedDaysAgo: 5
	},
	{
		n: 5,
		customer: 'felix.garrow@tackline.test',
		profile: 'felix',
		district: 'cobbleRow',
		garmentType: 'wide-leg-trousers',
		title: 'Relaxed wide-leg trousers in wool flannel',
		styleNotes: 'Mid rise, single pleat, turn-ups of about 4 cm. Belt loops and a button fly.',
		sizeBand: 'waist 84–88 cm, hip 98–102 cm',
		fabricSource: 'customer_supplies',
		fabricNotes: '3 m of mid-grey wool flannel, 148 cm wide.',
		budget: [15000, 22000],
		neededInDays: 40,
		handover: 'pickup',
		postedDaysAgo: 2
	},
	{
		n: 6,
		customer: 'nadia.kestrel@tackline.test',
		profile: 'nadia',
		district: 'ferrinHill',
		garmentType: 'a-line-skirt',
		title: 'Midi A-line skirt with deep pockets',
		styleNotes: 'Mid-calf length, wide waistband, pockets deep enough for a phone.',
		sizeBand: 'waist 66–70 cm, hip 92–96 cm',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Needlecord in rust or bottle green.',
		budget: [9000, 14000],
		neededInDays: 35,
		handover: 'pickup',
		postedDaysAgo: 6
	},
	{
		n: 7,
		customer: 'nadia.kestrel@tackline.test',
		profile: 'nadia',
		district: 'ferrinHill',
		garmentType: 'cropped-top',
		title: 'Boxy cropped top to go with the skirt',
		styleNotes: 'Short boxy top ending at the waistband, grown-on sleeves, buttons down the back.',
		sizeBand: 'bust 84–88 cm',
		fabricSource: 'customer_supplies',
		fabricNotes: 'About 80 cm of needlecord left over from the skirt, 140 cm wide.',
		budget: [5000, 8000],
		neededInDays: 35,
		handover: 'pickup',
		postedDaysAgo: 6
	}
];

function snapshotOf(profile: Profiles[ProfileKey]): MeasurementSnapshot {
	return {
		profileId: profile.id,
		label: profile.label,
		valuesMm: profile.valuesMm ?? {},
		takenBy: profile.takenBy,
		takenAt: profile.takenAt?.toISOString() ?? null
	};
}

export function demoCommissions(profiles: Profiles, now: Date): NewCommission[] {
	return demoCommissionList.map((c) => {
		const { n, customer, profile, district, budget, neededInDays, postedDaysAgo, ...rest } = c;
		const place = districts[district];
		const posted = postedDaysAgo !== undefined;
		return {
			...rest,
			id: demoId('commission', n),
			customerId: personId(customer),
			measurementSnapshot: posted ? snapshotOf(profiles[profile]) : null,
			budgetMinMinor: budget[0],
			budgetMaxMinor: budget[1],
			currency,
			dateNeeded: dateFrom(now, neededInDays),
			city,
			district: place.name,
			approxLat: coarse(place.lat),
			approxLng: coarse(place.lng),
			status: posted ? 'open' : 'draft',
			publishedAt: posted ? daysFrom(now, -postedDaysAgo) : null
		};
	});
}
