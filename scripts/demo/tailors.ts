import type { NewTailorProfile } from '../../src/lib/server/db/schema';
import { city, coarsen, currency, districts, type DistrictKey } from './city';
import { demoCountry } from './places';
import { personId } from './people';

type Workroom = {
	email: string;
	shopName: string;
	slug: string;
	district: DistrictKey;
	specialties: string[];
	bio: string;
	serviceRadiusKm: number;
	leadTimeDays: number;
	capacity: number;
	acceptingWork?: boolean;
	/** Euro cents per hour, and the mark-up on fabric the workroom buys. */
	hourlyRateMinor: number;
	fabricMarkupPercent: number;
	/** Per specialty: typical lead time in days and labour hours, in the order of `specialties`. */
	leadDays: number[];
	hours: number[];
};

const workrooms: Workroom[] = [
	{
		email: 'tailor@tackline.test',
		shopName: 'Obi Cut & Stitch',
		slug: 'obi-cut-and-stitch',
		district: 'oldQuay',
		specialties: ['wide-leg-trousers', 'straight-skirt', 'shift-dress'],
		bio: 'A two-person workroom by the old harbour. Marguerite trained on trousers and now cuts for everyone: wide legs that hang straight, skirts that sit level, and lined shift dresses with a clean finish inside. Fittings at the workroom, tea included.',
		serviceRadiusKm: 12,
		leadTimeDays: 14,
		capacity: 4,
		hourlyRateMinor: 3600,
		fabricMarkupPercent: 15,
		leadDays: [14, 10, 18],
		hours: [8, 5, 7.5]
	},
	{
		email: 'tobiah.marsh@tackline.test',
		shopName: 'Marsh Lane Tailoring',
		slug: 'marsh-lane-tailoring',
		district: 'loomside',
		specialties: ['wide-leg-trousers', 'tunic'],
		bio: 'Tobiah keeps a shelf of washed linens and cottons for customers who would rather not shop for fabric. Trousers and tunics made to last, with seams finished so they can be let out later.',
		serviceRadiusKm: 8,
		leadTimeDays: 21,
		capacity: 3,
		hourlyRateMinor: 3200,
		fabricMarkupPercent: 10,
		leadDays: [21, 14],
		hours: [9, 3.5]
	},
	{
		email: 'sunniva.crale@tackline.test',
		shopName: 'Crale Dressmaking',
		slug: 'crale-dressmaking',
		district: 'saltmarket',
		specialties: ['shift-dress', 'a-line-skirt'],
		bio: 'Occasion dresses and everyday skirts from a ground-floor room near the market. Every dress is tried first in calico, so the first fitting shows what the real cloth will do.',
		serviceRadiusKm: 10,
		leadTimeDays: 18,
		capacity: 3,
		hourlyRateMinor: 3800,
		fabricMarkupPercent: 20,
		leadDays: [18, 12],
		hours: [8, 4]
	},
	{
		email: 'reuben.frost@tackline.test',
		shopName: 'Frost Bespoke Room',
		slug: 'frost-bespoke-room',
		district: 'brightwater',
		specialties: ['wide-leg-trousers', 'straight-skirt', 'waistcoat'],
		bio: 'Slow, careful work in wool and linen: trousers, skirts and lined waistcoats with proper welt pockets. Two fittings as standard and pressing done by hand. Reuben takes on only a few orders at a time and tells you honestly when he is full.',
		serviceRadiusKm: 15,
		leadTimeDays: 28,
		capacity: 2,
		hourlyRateMinor: 4500,
		fabricMarkupPercent: 25,
		leadDays: [28, 21, 28],
		hours: [10, 6, 11]
	},
	{
		email: 'hettie.pellow@tackline.test',
		shopName: 'Pellow & Daughter',
		slug: 'pellow-and-daughter',
		district: 'ferrinHill',
		specialties: ['a-line-skirt', 'cropped-top', 'tunic'],
		bio: 'A mother-and-daughter workroom up on the hill. Quick turnaround on skirts and tops, pockets in everything, and a soft spot for corduroy.',
		serviceRadiusKm: 10,
		leadTimeDays: 10,
		capacity: 5,
		hourlyRateMinor: 2800,
		fabricMarkupPercent: 10,
		leadDays: [10, 8, 10],
		hours: [4, 4.5, 3]
	},
	{
		email: 'caius.brennagh@tackline.test',
		shopName: 'The Selvedge Room',
		slug: 'the-selvedge-room',
		district: 'theSallows',
		specialties: ['tunic', 'shift-dress'],
		bio: 'Natural fibres and customer-supplied cloth, cut to waste as little as possible. Tell Caius how much fabric you have and he will tell you what it can become.',
		serviceRadiusKm: 12,
		leadTimeDays: 21,
		capacity: 3,
		hourlyRateMinor: 3000,
		fabricMarkupPercent: 0,
		leadDays: [21, 25],
		hours: [3.5, 7]
	},
	{
		email: 'odalys.quill@tackline.test',
		shopName: 'Quill Atelier',
		slug: 'quill-atelier',
		district: 'cobbleRow',
		specialties: ['cropped-top', 'straight-skirt', 'shirt'],
		bio: 'Small, precise pieces: cropped tops with clean facings, straight skirts with a proper walking vent and blouses with a collar on a stand. Evening appointments for people who work during the day.',
		serviceRadiusKm: 8,
		leadTimeDays: 14,
		capacity: 3,
		hourlyRateMinor: 3900,
		fabricMarkupPercent: 15,
		leadDays: [14, 12, 18],
		hours: [4.5, 5.5, 8]
	},
	{
		email: 'benedek.harrow@tackline.test',
		shopName: 'Harrow Makes & Mends',
		slug: 'harrow-makes-and-mends',
		district: 'northmere',
		specialties: ['wide-leg-trousers', 'a-line-skirt'],
		bio: 'Twenty years of alterations taught Benedek where shop-bought trousers go wrong. Now he makes them from scratch, with generous seam allowances for letting out later.',
		serviceRadiusKm: 20,
		leadTimeDays: 12,
		capacity: 4,
		hourlyRateMinor: 3100,
		fabricMarkupPercent: 10,
		leadDays: [12, 10],
		hours: [7.5, 4]
	},
	{
		email: 'yusra.tamblin@tackline.test',
		shopName: 'Tamblin Stitchworks',
		slug: 'tamblin-stitchworks',
		district: 'kilnfield',
		specialties: ['tunic', 'cropped-top', 'wide-leg-trousers'],
		bio: 'Easy-wearing tunics and wide trousers, cut with room to move. Yusra is happy to work from a favourite garment you already own and want copied.',
		serviceRadiusKm: 10,
		leadTimeDays: 14,
		capacity: 3,
		hourlyRateMinor: 2900,
		fabricMarkupPercent: 12,
		leadDays: [14, 12, 16],
		hours: [3, 4, 8]
	},
	{
		email: 'petronella.vance@tackline.test',
		shopName: 'Vance Pleat House',
		slug: 'vance-pleat-house',
		district: 'wrenwick',
		specialties: ['a-line-skirt', 'straight-skirt'],
		bio: 'Skirts and only skirts: knife pleats, box pleats, godets and plain A-lines. Finishing a run of choir skirts at the moment, so not taking new work this month.',
		serviceRadiusKm: 12,
		leadTimeDays: 21,
		capacity: 2,
		hourlyRateMinor: 3400,
		fabricMarkupPercent: 15,
		leadDays: [21, 18],
		hours: [5, 5.5],
		acceptingWork: false
	},
	{
		email: 'ilse.moorcroft@tackline.test',
		shopName: 'Moorcroft Workroom',
		slug: 'moorcroft-workroom',
		district: 'loomside',
		specialties: ['shift-dress', 'cropped-top'],
		bio: 'Ilse drafts every pattern from your own measurements and keeps it on file, so your second dress comes together faster than the first.',
		serviceRadiusKm: 8,
		leadTimeDays: 21,
		capacity: 2,
		hourlyRateMinor: 3700,
		fabricMarkupPercent: 20,
		leadDays: [21, 14],
		hours: [7, 4.5]
	},
	{
		email: 'gideon.achterberg@tackline.test',
		shopName: 'Bobbin Street Tailors',
		slug: 'bobbin-street-tailors',
		district: 'saltmarket',
		specialties: ['straight-skirt', 'wide-leg-trousers', 'tunic'],
		bio: 'The largest workroom in Saltmarket: three cutters and two machinists, good with deadlines. Ask about the fabric library before you buy cloth elsewhere.',
		serviceRadiusKm: 15,
		leadTimeDays: 14,
		capacity: 6,
		hourlyRateMinor: 3300,
		fabricMarkupPercent: 18,
		leadDays: [14, 14, 10],
		hours: [5, 8, 3]
	}
];

/** Every demo workroom has finished onboarding: rates, lead times and a portfolio (see `seedDemo`). */
export function demoTailorProfiles(now: Date): NewTailorProfile[] {
	return workrooms.map(({ email, district, leadDays, hours, ...rest }) => ({
		...rest,
		userId: personId(email),
		city,
		district: districts[district].name,
		countryCode: demoCountry,
		...coarsen(districts[district]),
		leadTimes: Object.fromEntries(rest.specialties.map((id, i) => [id, leadDays[i]])),
		rateCurrency: currency,
		labourHours: Object.fromEntries(rest.specialties.map((id, i) => [id, hours[i]])),
		onboardedAt: now
	}));
}

/** The demo tailors' user ids, for seeding their portfolios. */
export function demoTailorIds(): string[] {
	return workrooms.map((w) => personId(w.email));
}
