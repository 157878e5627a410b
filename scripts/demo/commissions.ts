import { getTemplate, sizeBand, type GarmentId } from '../../src/lib/drafting';
import type { NewCommission } from '../../src/lib/server/db/schema';
import { city, coarsen, currency, districts, type DistrictKey } from './city';
import { demoId } from './ids';
import type { demoMeasurementProfiles, ProfileKey } from './measurements';
import { personId } from './people';
import { demoCountry } from './places';
import { dateFrom, daysFrom } from './time';

type Profiles = ReturnType<typeof demoMeasurementProfiles>;

type DemoCommission = Pick<
	NewCommission,
	'garmentType' | 'title' | 'styleNotes' | 'fabricSource' | 'fabricNotes' | 'handover'
> & {
	n: number;
	customer: string;
	profile: ProfileKey;
	district: DistrictKey;
	budget: [min: number, max: number];
	neededInDays: number;
	/** Absent for a draft. */
	postedDaysAgo?: number;
	/** Where it ended when it is no longer a draft or open. */
	ended?: 'cancelled' | 'expired';
};

/** How long a demo commission stays open, as COMMISSION_OPEN_DAYS defaults. */
const openDays = 30;

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
		fabricSource: 'customer_supplies',
		fabricNotes: 'About 80 cm of needlecord left over from the skirt, 140 cm wide.',
		budget: [5000, 8000],
		neededInDays: 35,
		handover: 'pickup',
		postedDaysAgo: 6
	},
	{
		n: 8,
		customer: 'tamsin.oyelaran@tackline.test',
		profile: 'tamsin',
		district: 'brightwater',
		garmentType: 'straight-skirt',
		title: 'Pencil skirt in navy crepe',
		styleNotes: 'Just below the knee, walking slit at the back, no waistband (faced instead).',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Heavy navy crepe with a little stretch.',
		budget: [9000, 13000],
		neededInDays: 20,
		handover: 'pickup',
		postedDaysAgo: 12,
		ended: 'cancelled'
	},
	{
		n: 9,
		customer: 'felix.garrow@tackline.test',
		profile: 'felix',
		district: 'cobbleRow',
		garmentType: 'tunic',
		title: 'Collarless work tunic in heavy cotton',
		styleNotes: 'Hip length, patch pocket on the chest, sleeves that roll up and stay there.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Undyed heavy cotton canvas or drill.',
		budget: [7000, 10000],
		neededInDays: 10,
		handover: 'delivery',
		postedDaysAgo: 34,
		ended: 'expired'
	},
	{
		n: 10,
		customer: 'nadia.kestrel@tackline.test',
		profile: 'nadia',
		district: 'ferrinHill',
		garmentType: 'shift-dress',
		title: 'Winter shift dress in wool crepe',
		styleNotes: 'Long sleeves, round neck, pockets in the side seams. Still choosing the colour.',
		fabricSource: 'customer_supplies',
		fabricNotes: '',
		budget: [18000, 26000],
		neededInDays: 70,
		handover: 'pickup'
	},
	// Commissions the demo orders (./orders.ts) grew from: posted, then awarded when the customer accepts a quote.
	{
		n: 11,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'straight-skirt',
		title: 'Winter skirt in grey wool flannel',
		styleNotes: 'Just below the knee, a back vent and a narrow waistband with one button. Lined, so it does not itch.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Mid-grey wool flannel, and a lining in cupro or viscose.',
		budget: [10000, 14000],
		neededInDays: 50,
		handover: 'pickup',
		postedDaysAgo: 4
	},
	{
		n: 12,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'shift-dress',
		title: 'Linen shift dress with pockets',
		styleNotes:
			'Round neck, cap sleeves, side-seam pockets and a hem just above the knee. Unlined, seams bound inside.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Washed linen in a soft ochre or terracotta.',
		budget: [16000, 22000],
		neededInDays: 35,
		handover: 'pickup',
		postedDaysAgo: 9
	},
	{
		n: 13,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'wide-leg-trousers',
		title: 'Charcoal wool trousers for the office',
		styleNotes:
			'High waist, one pleat each side, slant pockets and a hook-and-bar waistband. Full length with a plain hem.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Charcoal worsted, not too heavy.',
		budget: [15000, 21000],
		neededInDays: 21,
		handover: 'pickup',
		postedDaysAgo: 16
	},
	{
		n: 14,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'straight-skirt',
		title: 'Navy cotton skirt for every day',
		styleNotes: 'Knee length, a back zip and two patch pockets on the front.',
		fabricSource: 'customer_supplies',
		fabricNotes: '1.2 m of navy cotton twill, 145 cm wide, washed.',
		budget: [7000, 10000],
		neededInDays: 14,
		handover: 'pickup',
		postedDaysAgo: 20
	},
	{
		n: 15,
		customer: 'customer@tackline.test',
		profile: 'rosalind',
		district: 'oldQuay',
		garmentType: 'wide-leg-trousers',
		title: 'Cream wide-leg trousers for the summer',
		styleNotes: 'Drawstring-free elastic back waist, flat front, side pockets. Ankle length.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Cream cotton-linen, opaque enough not to need a lining.',
		budget: [12000, 16000],
		neededInDays: 10,
		handover: 'pickup',
		postedDaysAgo: 24
	},
	{
		n: 16,
		customer: 'tamsin.oyelaran@tackline.test',
		profile: 'tamsin',
		district: 'brightwater',
		garmentType: 'a-line-skirt',
		title: 'Midi A-line skirt in green needlecord',
		styleNotes: 'Mid-calf, wide waistband, in-seam pockets and a side zip.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Bottle-green needlecord.',
		budget: [9000, 13000],
		neededInDays: 40,
		handover: 'pickup',
		postedDaysAgo: 7
	},
	{
		n: 17,
		customer: 'tamsin.oyelaran@tackline.test',
		profile: 'tamsin',
		district: 'brightwater',
		garmentType: 'shift-dress',
		title: 'Lined shift dress for a christening',
		styleNotes: 'Bateau neckline, three-quarter sleeves, hem at the knee. Fully lined, invisible zip at the back.',
		fabricSource: 'tailor_sources',
		fabricNotes: 'Dusty-blue crepe with a cotton lawn lining.',
		budget: [20000, 28000],
		neededInDays: 12,
		handover: 'delivery',
		postedDaysAgo: 26
	}
];

/** What publishing writes beside each posted commission: the frozen measurements and the size band. */
export function demoCommissionMeasurements(profiles: Profiles) {
	return demoCommissionList
		.filter((c) => c.postedDaysAgo !== undefined)
		.map((c) => {
			const profile = profiles[c.profile];
			const commissionId = demoId('commission', c.n);
			const valuesMm = profile.valuesMm ?? {};
			const band = sizeBand(valuesMm, getTemplate(c.garmentType as GarmentId).category);
			return {
				snapshot: {
					commissionId,
					profileId: profile.id,
					label: profile.label,
					unit: profile.unit ?? 'cm',
					valuesMm,
					takenBy: profile.takenBy,
					takenAt: profile.takenAt ?? null
				},
				band: (band?.dimensions ?? []).map((d, i) => ({
					commissionId,
					dimension: d.code,
					position: i + 1,
					lowerMm: Math.round(d.minCm * 10),
					upperMm: Math.round(d.maxCm * 10)
				}))
			};
		});
}

export function demoCommissions(now: Date): NewCommission[] {
	return demoCommissionList.map((c) => {
		const { n, customer, profile, district, budget, neededInDays, postedDaysAgo, ended, ...rest } = c;
		const place = districts[district];
		const posted = postedDaysAgo !== undefined;
		const publishedAt = posted ? daysFrom(now, -postedDaysAgo) : null;
		const point = coarsen(place);
		return {
			...rest,
			id: demoId('commission', n),
			customerId: personId(customer),
			budgetMinMinor: budget[0],
			budgetMaxMinor: budget[1],
			currency,
			dateNeeded: dateFrom(now, ended === 'expired' ? neededInDays - (postedDaysAgo ?? 0) : neededInDays),
			city,
			district: place.name,
			countryCode: demoCountry,
			approxLat: point.lat,
			approxLng: point.lng,
			status: ended ?? (posted ? 'open' : 'draft'),
			publishedAt,
			expiresAt: publishedAt && daysFrom(publishedAt, openDays)
		};
	});
}
