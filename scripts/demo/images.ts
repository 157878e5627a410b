/**
 * Demo pictures drawn here (SVG rendered by sharp), never photographs and never people: fabric swatches,
 * flat garment silhouettes and paper pattern pieces on a cutting table. They go through the photos
 * domain functions, so the seed leaves real objects in the S3 stand-in.
 */
import sharp from 'sharp';
import type { Database } from '../../src/lib/server/db/client';

export type DemoPicture =
	| { kind: 'swatch'; pattern: 'stripes' | 'check' | 'herringbone' | 'dots'; colours: [string, string] }
	| { kind: 'garment'; garment: string; colour: string }
	| { kind: 'pieces'; paper: string };

export type DemoPortfolioItem = { caption: string; garmentType: string | null; pictures: DemoPicture[] };

const width = 1200;
const height = 900;

function swatch(pattern: string, [base, accent]: [string, string]) {
	const motifs: Record<string, string> = {
		stripes: `<rect width="40" height="40" fill="${base}"/><rect width="12" height="40" fill="${accent}"/>`,
		check: `<rect width="40" height="40" fill="${base}"/><rect width="20" height="20" fill="${accent}" opacity=".7"/><rect x="20" y="20" width="20" height="20" fill="${accent}" opacity=".4"/>`,
		herringbone: `<rect width="40" height="40" fill="${base}"/><path d="M0 40L20 0M20 40L40 0M0 0l20 40" stroke="${accent}" stroke-width="5"/>`,
		dots: `<rect width="40" height="40" fill="${base}"/><circle cx="20" cy="20" r="6" fill="${accent}"/>`
	};
	const pinked = Array.from({ length: 31 }, (_, i) => `${200 + i * 26},${i % 2 ? 150 : 165}`).join(' ');
	return `<defs><pattern id="p" width="40" height="40" patternUnits="userSpaceOnUse" patternTransform="rotate(8)">${motifs[pattern]}</pattern></defs>
<rect width="${width}" height="${height}" fill="#b98a5e"/>
<path d="M0 300h${width}M0 620h${width}" stroke="#a27650" stroke-width="6"/>
<polygon points="${pinked} 980,760 200,760" fill="url(#p)" stroke="#00000033" stroke-width="3"/>
<rect x="840" y="650" width="220" height="60" rx="6" fill="#fcfaf6" transform="rotate(-6 950 680)"/>`;
}

const silhouettes: Record<string, string> = {
	'wide-leg-trousers': 'M470 150h260l10 80 70 520h-170l-40-430-40 430h-170l70-520z',
	'straight-skirt': 'M480 180h240l30 560h-300z',
	'a-line-skirt': 'M500 180h200l140 560h-480z',
	'shift-dress': 'M520 140l-120 60 40 120 60-30-20 500h240l-20-500 60 30 40-120-120-60q-80 50-160 0z',
	'cropped-top': 'M500 240l-150 70 40 120 80-30v150h260v-150l80 30 40-120-150-70q-100 50-200 0z',
	tunic: 'M510 150l-170 80 50 140 70-30-10 430h300l-10-430 70 30 50-140-170-80q-90 50-180 0z',
	shirt: 'M540 150l-110 40-110 440 70 20 80-330v420h260v-420l80 330 70-20-110-440-110-40-60 50z',
	waistcoat: 'M530 150l-70 30q-10 120-40 170l10 330 160 70 10-30 10 30 160-70 10-330q-30-50-40-170l-70-30-70 250z'
};

function garment(id: string, colour: string) {
	const path = silhouettes[id] ?? silhouettes['shift-dress'];
	return `<rect width="${width}" height="${height}" fill="#ede4d3"/>
<path d="M0 0h${width}v${height}H0z" fill="none" stroke="#ddd0b6" stroke-width="40"/>
<path d="${path}" fill="${colour}" stroke="#171923" stroke-opacity=".35" stroke-width="6"/>
<path d="${path}" fill="none" stroke="#fcfaf6" stroke-opacity=".6" stroke-width="2" stroke-dasharray="10 8" transform="translate(600 450) scale(.96) translate(-600 -450)"/>`;
}

function pieces(paper: string) {
	const notch = (x: number, y: number) => `<path d="M${x - 8} ${y}l8 -16 8 16z" fill="#171923"/>`;
	return `<rect width="${width}" height="${height}" fill="#8d6a48"/>
<path d="M0 220h${width}M0 520h${width}M0 800h${width}" stroke="#7a5b3c" stroke-width="5"/>
<polygon points="150,120 520,150 560,760 120,720" fill="${paper}" stroke="#474b59" stroke-width="4"/>
<polygon points="640,140 1020,110 1060,520 700,560" fill="${paper}" stroke="#474b59" stroke-width="4"/>
<path d="M700 640q170-60 340 0l-20 150h-300z" fill="${paper}" stroke="#474b59" stroke-width="4"/>
<path d="M340 260v380M326 280l14-24 14 24M326 620l14 24 14-24M860 190v280M846 210l14-24 14 24" stroke="#a93c25" stroke-width="4" fill="none"/>
${notch(330, 134)}${notch(840, 124)}${notch(860, 640)}
<rect x="60" y="820" width="1080" height="36" fill="#f0d268"/>
${Array.from({ length: 54 }, (_, i) => `<path d="M${70 + i * 20} 820v${i % 5 ? 12 : 22}" stroke="#171923" stroke-width="2"/>`).join('')}`;
}

const rendered = new Map<string, Promise<Uint8Array>>();

/** One demo picture as a JPEG, the way a phone would send it (each distinct picture drawn once). */
export function renderPicture(picture: DemoPicture): Promise<Uint8Array> {
	const key = JSON.stringify(picture);
	if (!rendered.has(key)) rendered.set(key, draw(picture));
	return rendered.get(key)!;
}

async function draw(picture: DemoPicture): Promise<Uint8Array> {
	const body =
		picture.kind === 'swatch'
			? swatch(picture.pattern, picture.colours)
			: picture.kind === 'garment'
				? garment(picture.garment, picture.colour)
				: pieces(picture.paper);
	// Drawn on a 1200 × 900 canvas and rendered at 600 × 450, which keeps the seed quick.
	const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width / 2}" height="${height / 2}" viewBox="0 0 ${width} ${height}">${body}</svg>`;
	return new Uint8Array(await sharp(Buffer.from(svg)).jpeg({ quality: 85 }).toBuffer());
}

const palette = ['#24495a', '#a93c25', '#3f6b35', '#8f6a07', '#474b59', '#c84d31', '#356f87'];

/** What a customer might send with a commission for `garment`: the shape, a swatch, the pieces. */
export function commissionPictures(garmentType: string, n: number, seed = 0): DemoPicture[] {
	const colour = palette[seed % palette.length];
	const all: DemoPicture[] = [
		{ kind: 'garment', garment: garmentType, colour },
		{
			kind: 'swatch',
			pattern: (['stripes', 'check', 'herringbone', 'dots'] as const)[seed % 4],
			colours: ['#f7f2e9', colour]
		},
		{ kind: 'pieces', paper: '#fcfaf6' },
		{ kind: 'swatch', pattern: 'herringbone', colours: [colour, '#ede4d3'] }
	];
	return Array.from({ length: n }, (_, i) => all[i % all.length]);
}

const alt: Record<DemoPicture['kind'], string> = {
	swatch: 'Fabric swatch with pinked edges on the cutting table',
	garment: 'Flat drawing of the garment’s outline',
	pieces: 'Paper pattern pieces laid out on the cutting table'
};

/** Loaded after the Kit shims are registered: the photos domain imports `$lib/…` and `$env/…`. */
async function photosDomain() {
	// Under Vitest, Vite already resolves them.
	if (!process.env.VITEST) await import('../lib/kit-modules');
	return import('../../src/lib/server/photos');
}

/** True when a bucket is configured (the S3 stand-in under `npm start` / `npm test`). */
export const storageConfigured = () => Boolean(process.env.S3_BUCKET);

/**
 * Gives a commission `n` drawn reference photos, whatever its status, unless it has photos already
 * (so a second seed run adds nothing). Returns how many were added.
 */
export async function seedCommissionPhotos(db: Database, commissionId: string, n: number, garmentType = 'shift-dress') {
	const { commissionPhotos } = await photosDomain();
	if ((await commissionPhotos.photoCount(db, { commissionId })) > 0) return 0;
	const seed = parseInt(commissionId.slice(-4), 16) || 0;
	for (const picture of commissionPictures(garmentType, n, seed)) {
		await commissionPhotos.addWithoutChecks(db, {
			commissionId,
			file: await renderPicture(picture),
			altText: alt[picture.kind]
		});
	}
	return n;
}

/** Fills an empty portfolio of a workroom (its tailor profile must exist) through the portfolio functions. */
export async function seedPortfolio(db: Database, tailorId: string, items: DemoPortfolioItem[]) {
	const { portfolio } = await photosDomain();
	if ((await portfolio.listItems(db, { tailorId })).length > 0) return 0;
	const actor = { id: tailorId, role: 'tailor' as const };
	let added = 0;
	for (const item of items) {
		const created = await portfolio.createItem(db, { actor, caption: item.caption, garmentType: item.garmentType });
		for (const picture of item.pictures) {
			await portfolio.addPhoto(db, {
				actor,
				itemId: created.id,
				file: await renderPicture(picture),
				altText: alt[picture.kind]
			});
			added += 1;
		}
	}
	return added;
}

/** A small portfolio for a workroom with these specialties: a piece for each of the first two, one picture each. */
export function portfolioFor(specialties: string[], seed = 0): DemoPortfolioItem[] {
	return specialties.slice(0, 2).map((garmentType, i) => {
		const colour = palette[(seed + i) % palette.length];
		return {
			caption: `${garmentType.replace(/-/g, ' ').replace(/^./, (c) => c.toUpperCase())}, cut and finished in the workroom`,
			garmentType,
			pictures: [i % 2 ? { kind: 'pieces', paper: '#fcfaf6' } : { kind: 'garment', garment: garmentType, colour }]
		};
	});
}

/** Drawn photos for the demo city's commissions (drafts one, posted ones two) and every demo workroom's portfolio. */
export async function seedDemoPhotos(
	db: Database,
	commissions: { id: string; garmentType: string; status: string }[],
	workrooms: { userId: string; specialties: string[] }[]
) {
	let added = 0;
	for (const c of commissions)
		added += await seedCommissionPhotos(db, c.id, c.status === 'draft' ? 1 : 2, c.garmentType);
	for (const [i, w] of workrooms.entries()) added += await seedPortfolio(db, w.userId, portfolioFor(w.specialties, i));
	return added;
}
