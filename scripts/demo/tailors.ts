import type { NewTailorProfile } from '../../src/lib/server/db/schema';
import { city, districts, type DistrictKey } from './city';
import { personId } from './people';

type Workroom = {
	email: string;
	shopName: string;
	slug: string;
	district: DistrictKey;
	lat: number;
	lng: number;
	specialties: string[];
	bio: string;
	serviceRadiusKm: number;
	leadTimeDays: number;
	capacity: number;
	acceptingWork?: boolean;
};

const workrooms: Workroom[] = [
	{
		email: 'tailor@tackline.test',
		shopName: 'Obi Cut & Stitch',
		slug: 'obi-cut-and-stitch',
		district: 'oldQuay',
		lat: 46.8519,
		lng: 3.2081,
		specialties: ['wide-leg-trousers', 'straight-skirt', 'shift-dress'],
		bio: 'A two-person workroom above the chandlery on Tiller Street. Marguerite trained on trousers and now cuts for everyone: wide legs that hang straight, skirts that sit level, and lined shift dresses with a clean finish inside. Fittings at the workroom, tea included.',
		serviceRadiusKm: 12,
		leadTimeDays: 14,
		capacity: 4
	},
	{
		email: 'tobiah.marsh@tackline.test',
		shopName: 'Marsh Lane Tailoring',
		slug: 'marsh-lane-tailoring',
		district: 'loomside',
		lat: 46.8592,
		lng: 3.2214,
		specialties: ['wide-leg-trousers', 'tunic'],
		bio: 'Tobiah keeps a shelf of washed linens and cottons for customers who would rather not shop for fabric. Trousers and tunics made to last, with seams finished so they can be let out later.',
		serviceRadiusKm: 8,
		leadTimeDays: 21,
		capacity: 3
	},
	{
		email: 'sunniva.crale@tackline.test',
		shopName: 'Crale Dressmaking',
		slug: 'crale-dressmaking',
		district: 'saltmarket',
		lat: 46.8471,
		lng: 3.2027,
		specialties: ['shift-dress', 'a-line-skirt'],
		bio: 'Occasion dresses and everyday skirts from a ground-floor room on Brinewater Row. Every dress is tried first in calico, so the first fitting shows what the real cloth will do.',
		serviceRadiusKm: 10,
		leadTimeDays: 18,
		capacity: 3
	},
	{
		email: 'reuben.frost@tackline.test',
		shopName: 'Frost Bespoke Room',
		slug: 'frost-bespoke-room',
		district: 'brightwater',
		lat: 46.8626,
		lng: 3.1949,
		specialties: ['wide-leg-trousers', 'straight-skirt'],
		bio: 'Slow, careful work in wool and linen. Two fittings as standard and pressing done by hand. Reuben takes on only a few orders at a time and tells you honestly when he is full.',
		serviceRadiusKm: 15,
		leadTimeDays: 28,
		capacity: 2
	},
	{
		email: 'hettie.pellow@tackline.test',
		shopName: 'Pellow & Daughter',
		slug: 'pellow-and-daughter',
		district: 'ferrinHill',
		lat: 46.8392,
		lng: 3.2251,
		specialties: ['a-line-skirt', 'cropped-top', 'tunic'],
		bio: 'A mother-and-daughter workroom at the top of Lantern Steps. Quick turnaround on skirts and tops, pockets in everything, and a soft spot for corduroy.',
		serviceRadiusKm: 10,
		leadTimeDays: 10,
		capacity: 5
	},
	{
		email: 'caius.brennagh@tackline.test',
		shopName: 'The Selvedge Room',
		slug: 'the-selvedge-room',
		district: 'theSallows',
		lat: 46.8707,
		lng: 3.2305,
		specialties: ['tunic', 'shift-dress'],
		bio: 'Natural fibres and customer-supplied cloth, cut to waste as little as possible. Tell Caius how much fabric you have and he will tell you what it can become.',
		serviceRadiusKm: 12,
		leadTimeDays: 21,
		capacity: 3
	},
	{
		email: 'odalys.quill@tackline.test',
		shopName: 'Quill Atelier',
		slug: 'quill-atelier',
		district: 'cobbleRow',
		lat: 46.8556,
		lng: 3.198,
		specialties: ['cropped-top', 'straight-skirt'],
		bio: 'Small, precise pieces: cropped tops with clean facings and straight skirts with a proper walking vent. Evening appointments for people who work during the day.',
		serviceRadiusKm: 8,
		leadTimeDays: 14,
		capacity: 3
	},
	{
		email: 'benedek.harrow@tackline.test',
		shopName: 'Harrow Makes & Mends',
		slug: 'harrow-makes-and-mends',
		district: 'northmere',
		lat: 46.8801,
		lng: 3.2098,
		specialties: ['wide-leg-trousers', 'a-line-skirt'],
		bio: 'Twenty years of alterations taught Benedek where shop-bought trousers go wrong. Now he makes them from scratch, with generous seam allowances for letting out later.',
		serviceRadiusKm: 20,
		leadTimeDays: 12,
		capacity: 4
	},
	{
		email: 'yusra.tamblin@tackline.test',
		shopName: 'Tamblin Stitchworks',
		slug: 'tamblin-stitchworks',
		district: 'kilnfield',
		lat: 46.8331,
		lng: 3.1906,
		specialties: ['tunic', 'cropped-top', 'wide-leg-trousers'],
		bio: 'Easy-wearing tunics and wide trousers, cut with room to move. Yusra is happy to work from a favourite garment you already own and want copied.',
		serviceRadiusKm: 10,
		leadTimeDays: 14,
		capacity: 3
	},
	{
		email: 'petronella.vance@tackline.test',
		shopName: 'Vance Pleat House',
		slug: 'vance-pleat-house',
		district: 'wrenwick',
		lat: 46.8456,
		lng: 3.2427,
		specialties: ['a-line-skirt', 'straight-skirt'],
		bio: 'Skirts and only skirts: knife pleats, box pleats, godets and plain A-lines. Finishing a run of choir skirts at the moment, so not taking new work this month.',
		serviceRadiusKm: 12,
		leadTimeDays: 21,
		capacity: 2,
		acceptingWork: false
	},
	{
		email: 'ilse.moorcroft@tackline.test',
		shopName: 'Moorcroft Workroom',
		slug: 'moorcroft-workroom',
		district: 'loomside',
		lat: 46.8579,
		lng: 3.219,
		specialties: ['shift-dress', 'cropped-top'],
		bio: 'Ilse drafts every pattern from your own measurements and keeps it on file, so your second dress comes together faster than the first.',
		serviceRadiusKm: 8,
		leadTimeDays: 21,
		capacity: 2
	},
	{
		email: 'gideon.achterberg@tackline.test',
		shopName: 'Bobbin Street Tailors',
		slug: 'bobbin-street-tailors',
		district: 'saltmarket',
		lat: 46.8459,
		lng: 3.2043,
		specialties: ['straight-skirt', 'wide-leg-trousers', 'tunic'],
		bio: 'The largest workroom in Saltmarket: three cutters and two machinists, good with deadlines. Ask about the fabric library before you buy cloth elsewhere.',
		serviceRadiusKm: 15,
		leadTimeDays: 14,
		capacity: 6
	}
];

export function demoTailorProfiles(): NewTailorProfile[] {
	return workrooms.map(({ email, district, ...rest }) => ({
		...rest,
		userId: personId(email),
		city,
		district: districts[district].name
	}));
}
