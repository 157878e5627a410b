import { describe, expect, it } from 'vitest';
import { hopperTurtonC1P1 } from '../../src/lib/drafting/strip-packing-instances';

const baseUrl = process.env.TACKLINE_BASE_URL ?? 'http://localhost:3000';

async function post(path: string, body: unknown, raw = false) {
	const response = await fetch(baseUrl + path, {
		method: 'POST',
		headers: { 'content-type': 'application/json', origin: baseUrl },
		body: raw ? (body as string) : JSON.stringify(body)
	});
	return { status: response.status, body: await response.json() };
}

type Issue = { path: string; message: string };
const issuePaths = (body: { error: { issues: Issue[] } }) => body.error.issues.map((i) => i.path);

// The working dressmaker's trouser method (common practice), worked example in inches.
const trousers = {
	garment: 'wide-leg-trousers',
	unit: 'in',
	measurements: { hip_girth: 40, waist_girth: 28, thigh_girth: 25 },
	options: { length: 45.5 }
};

function lineValues(body: { pieces: Array<{ id: string; lines: Array<{ id: string; value: number }> }> }) {
	return Object.fromEntries(body.pieces.flatMap((p) => p.lines.map((l) => [`${p.id}.${l.id}`, l.value])));
}

describe('GET /api/v1/garments', () => {
	it('lists the eight garments with required measurements and options', async () => {
		const response = await fetch(`${baseUrl}/api/v1/garments?unit=in`);
		expect(response.status).toBe(200);
		const garments = await response.json();
		expect(garments.map((g: { id: string }) => g.id)).toEqual([
			'wide-leg-trousers',
			'cropped-top',
			'straight-skirt',
			'a-line-skirt',
			'shift-dress',
			'tunic',
			'shirt',
			'waistcoat'
		]);
		const first = garments[0];
		expect(first.requiredMeasurements).toEqual(['hip_girth', 'waist_girth', 'thigh_girth']);
		expect(first.options.find((o: { id: string }) => o.id === 'waistbandDepth')).toMatchObject({
			kind: 'length',
			unit: 'in',
			default: 1.5
		});
	});

	it('refuses an unknown unit with the error body', async () => {
		const response = await fetch(`${baseUrl}/api/v1/garments?unit=mm`);
		expect(response.status).toBe(400);
		const body = await response.json();
		expect(body.error.code).toBe('invalid_input');
		expect(issuePaths(body)).toEqual(['unit']);
	});

	it('answers the same list with a validator and a cache lifetime, and 304 when the copy is current', async () => {
		const first = await fetch(`${baseUrl}/api/v1/garments?unit=cm`);
		const etag = first.headers.get('etag');
		expect(etag).toMatch(/^"[\w-]+"$/);
		expect(first.headers.get('cache-control')).toBe('public, max-age=3600');
		const inches = await fetch(`${baseUrl}/api/v1/garments?unit=in`);
		expect(inches.headers.get('etag')).not.toBe(etag);

		const again = await fetch(`${baseUrl}/api/v1/garments?unit=cm`, { headers: { 'if-none-match': `W/${etag}` } });
		expect(again.status).toBe(304);
		expect(await again.text()).toBe('');
		expect(again.headers.get('etag')).toBe(etag);
		const stale = await fetch(`${baseUrl}/api/v1/garments?unit=cm`, { headers: { 'if-none-match': '"old"' } });
		expect(stale.status).toBe(200);
		expect(await stale.json()).toEqual(await first.json());
	});
});

describe('POST /api/v1/drafts', () => {
	it('drafts the trousers by the dressmaker’s method (common practice check values)', async () => {
		const { status, body } = await post('/api/v1/drafts', trousers);
		expect(status).toBe(200);
		expect(body.errors).toEqual([]);
		expect(lineValues(body)).toMatchObject({
			'front.hip_line_depth': 10,
			'front.crotch_depth': 11.5,
			'front.thigh_line_depth': 14,
			'front.hip_width': 11,
			'front.crotch_extension': 2.5,
			'front.waist_width': 9,
			'front.thigh_width': 13,
			'front.leg_length': 46,
			'front.fold_width': 16,
			'back.crotch_extension': 4.5,
			'waistband.cut_width': 4
		});
		expect(body.pieces[0].svg).toMatch(/^<svg/);
		expect(body.fabric).toMatchObject({ buyUnit: 'yd', folded: true });
		expect(body.sizeBand.text).toMatch(/^waist \d+–\d+ cm, hip \d+–\d+ cm$/);
	});

	it('drafts the cropped top (common practice: bust 36 → fold width 16, bust width 11, dart at 3.5)', async () => {
		const { body } = await post('/api/v1/drafts', {
			garment: 'cropped-top',
			unit: 'in',
			measurements: { bust_girth: 36, shoulder_width: 15, shoulder_to_bust_point: 9.5, bust_point_span: 7 },
			options: { length: 18 }
		});
		expect(lineValues(body)).toMatchObject({
			'front.fold_width': 16,
			'front.bust_width': 11,
			'front.dart_position': 3.5,
			'front.sleeve_length': 7
		});
	});

	it('gives the same geometry for the same body in centimetres', async () => {
		const inches = await post('/api/v1/drafts', trousers);
		const cm = await post('/api/v1/drafts', {
			...trousers,
			unit: 'cm',
			measurements: { hip_girth: 101.6, waist_girth: 71.12, thigh_girth: 63.5 },
			options: { length: 115.57 }
		});
		const points: Array<[number, number]> = inches.body.pieces[0].outlineMm;
		points.forEach(([x, y], i) => {
			expect(cm.body.pieces[0].outlineMm[i][0]).toBeCloseTo(x, 1);
			expect(cm.body.pieces[0].outlineMm[i][1]).toBeCloseTo(y, 1);
		});
		expect(lineValues(cm.body)['front.hip_width']).toBeCloseTo(27.94, 2);
	});

	it('reports missing measurements as errors, without pieces', async () => {
		const { status, body } = await post('/api/v1/drafts', { ...trousers, measurements: { hip_girth: 40 } });
		expect(status).toBe(200);
		expect(body.pieces).toEqual([]);
		expect(body.errors[0]).toMatchObject({ code: 'missing_measurements', fields: ['waist_girth', 'thigh_girth'] });
	});

	it('answers 400 with the issues for bad input', async () => {
		const notJson = await post('/api/v1/drafts', '{"garment":', true);
		expect(notJson.status).toBe(400);
		expect(notJson.body.error.code).toBe('invalid_json');

		const badGarment = await post('/api/v1/drafts', { ...trousers, garment: 'cape' });
		expect(badGarment.status).toBe(400);
		expect(badGarment.body.error.code).toBe('invalid_input');
		expect(issuePaths(badGarment.body)).toEqual(['garment']);

		const negative = await post('/api/v1/drafts', { ...trousers, measurements: { hip_girth: -40 } });
		expect(issuePaths(negative.body)).toEqual(['measurements.hip_girth']);

		const foreignOption = await post('/api/v1/drafts', { ...trousers, options: { neckTies: true } });
		expect(foreignOption.status).toBe(400);
		expect(issuePaths(foreignOption.body)).toEqual(['options.neckTies']);

		const shortLength = await post('/api/v1/drafts', { ...trousers, options: { length: 5 } });
		expect(issuePaths(shortLength.body)).toEqual(['options.length']);
	});
});

describe('POST /api/v1/drafts — measurements no body has', () => {
	it('answers 422 with the field for a 99 999 cm hip (ANSUR II and NHANES 2017–2020 maxima are under 2 m)', async () => {
		const { status, body } = await post('/api/v1/drafts', {
			garment: 'straight-skirt',
			unit: 'cm',
			measurements: { waist_girth: 72, hip_girth: 99_999, waist_to_hip: 20.6 }
		});
		expect(status).toBe(422);
		expect(body.error.code).toBe('implausible_measurements');
		expect(issuePaths(body)).toEqual(['measurements.hip_girth']);
	});

	it('answers 422 for inches sent as cm until unitConfirmed says they are right', async () => {
		// The EN 13402-3 body 88-72-96 cm typed in inches (waist 28 ¼, hip 37 ¾, waist to hip 8 ⅛).
		const request = {
			garment: 'straight-skirt',
			unit: 'cm',
			measurements: { waist_girth: 28.25, hip_girth: 37.75, waist_to_hip: 8.125 }
		};
		const stopped = await post('/api/v1/drafts', request);
		expect(stopped.status).toBe(422);
		expect(stopped.body.error.message).toMatch(/another unit/);
		const asInches = await post('/api/v1/drafts', { ...request, unit: 'in' });
		expect(asInches.status).toBe(200);
		const confirmed = await post('/api/v1/drafts', { ...request, unitConfirmed: true });
		expect(confirmed.status).toBe(200);
		expect(confirmed.body.warnings.map((w: { code: string }) => w.code)).toContain('unit_mixup');
	});
});

describe('POST /api/v1/layouts', () => {
	it('packs four 5×5 squares into a 10-wide strip at the optimum (hand check: OPT = A/W = 10)', async () => {
		const { status, body } = await post('/api/v1/layouts', {
			width: 10,
			unit: 'cm',
			pieces: [{ w: 5, h: 5, quantity: 4 }]
		});
		expect(status).toBe(200);
		expect(body).toMatchObject({ length: 10, efficiency: 1 });
		expect(body.placements).toHaveLength(4);
	});

	it('stays within the FFDH bound on Hopper–Turton C1-P1 (W 20, OPT 20, h_max 12)', async () => {
		const { body } = await post('/api/v1/layouts', {
			width: 20,
			unit: 'in',
			pieces: hopperTurtonC1P1.items
		});
		// Coffman, Garey, Johnson & Tarjan (1980): FFDH ≤ 1.7·OPT + h_max = 46; never below OPT.
		expect(body.length).toBeGreaterThanOrEqual(20);
		expect(body.length).toBeLessThanOrEqual(46);
		for (const p of body.placements) expect(p.x + p.w).toBeLessThanOrEqual(20);
	});

	it('answers 400 for a piece wider than the fabric or an empty list', async () => {
		const wide = await post('/api/v1/layouts', { width: 10, unit: 'cm', pieces: [{ w: 12, h: 3 }] });
		expect(wide.status).toBe(400);
		expect(issuePaths(wide.body)).toEqual(['pieces.0.w']);
		const empty = await post('/api/v1/layouts', { width: 10, unit: 'cm', pieces: [] });
		expect(issuePaths(empty.body)).toEqual(['pieces']);
	});
});

describe('POST /api/v1/quotes/estimate', () => {
	it('itemises the price in integer minor units', async () => {
		const { status, body } = await post('/api/v1/quotes/estimate', {
			currency: 'USD',
			fabric: { supply: 'tailor', pricePerUnitMinor: 1299, per: 'yd', length: 2.625 },
			labourHours: 8,
			hourlyRateMinor: 3500,
			notions: [{ label: 'Zip', amountMinor: 450 }]
		});
		expect(status).toBe(200);
		expect(body.lines.map((l: { amountMinor: number }) => l.amountMinor)).toEqual([3410, 28000, 450]);
		expect(body.totalMinor).toBe(31860);
		expect(body.exponent).toBe(2);
	});

	it('uses the garment’s default labour hours and a zero-decimal currency (ISO 4217: JPY 0)', async () => {
		const { body } = await post('/api/v1/quotes/estimate', {
			currency: 'JPY',
			garment: 'tunic',
			fabric: { supply: 'customer' },
			hourlyRateMinor: 3000
		});
		expect(body).toMatchObject({ exponent: 0, labourHours: 3, totalMinor: 9000 });
	});

	it('answers 400 for money as a float or an unknown currency', async () => {
		const float = await post('/api/v1/quotes/estimate', {
			currency: 'USD',
			labourHours: 1,
			fabric: { supply: 'customer' },
			hourlyRateMinor: 35.5
		});
		expect(float.status).toBe(400);
		expect(issuePaths(float.body)).toEqual(['hourlyRateMinor']);
		const currency = await post('/api/v1/quotes/estimate', {
			currency: 'ABC',
			labourHours: 1,
			fabric: { supply: 'customer' },
			hourlyRateMinor: 3500
		});
		expect(issuePaths(currency.body)).toEqual(['currency']);
	});
});
