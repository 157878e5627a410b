import { describe, expect, it } from 'vitest';
import { quoteWorking } from '$lib/quotes/working';
import { fabricEstimateForBand, liningEstimateForBand } from '../commissions';
import { prefill, startingFabricPricePerMetre, startingLiningPricePerMetre } from './helper';

// Cost-plus pricing as small workrooms quote (common practice): cloth bought × its price, a mark-up on the
// cloth for buying and handling it, and labour hours × the hourly rate. Expected figures are worked by hand.
describe('the quote helper working', () => {
	it('adds fabric, the mark-up on fabric and labour, in minor units', () => {
		const working = quoteWorking({
			currency: 'EUR',
			tailorSourcesFabric: true,
			fabricMetres: 1.6,
			fabricPricePerMetreMinor: 2500,
			labourHours: 6,
			hourlyRateMinor: 2800,
			markupPercent: 15
		});
		// 1.6 m × 25.00 = 40.00; 15 % of 40.00 = 6.00; 6 h × 28.00 = 168.00.
		expect(working.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 4000],
			['markup', 600],
			['labour', 16800]
		]);
		expect(working.totalMinor).toBe(21400);
		expect(working.lines[0].detail).toBe('1.6 m × 25.00 EUR');
		// The usual range the drafting helper suggests: ±10 % (common practice), 192.60 to 235.40.
		expect(working.range).toEqual({ lowMinor: 19260, highMinor: 23540 });
	});

	it('rounds the mark-up half up once', () => {
		// 1 m × 33.33 = 33.33; 15 % is 4.9995 → 5.00.
		const working = quoteWorking({
			currency: 'EUR',
			tailorSourcesFabric: true,
			fabricMetres: 1,
			fabricPricePerMetreMinor: 3333,
			labourHours: 0,
			hourlyRateMinor: 0,
			markupPercent: 15
		});
		expect(working.lines.find((l) => l.id === 'markup')?.amountMinor).toBe(500);
		expect(working.totalMinor).toBe(3833);
	});

	it('charges nothing for cloth the customer brings, and no mark-up on it', () => {
		const working = quoteWorking({
			currency: 'EUR',
			tailorSourcesFabric: false,
			fabricMetres: 2,
			fabricPricePerMetreMinor: 2500,
			labourHours: 9.5,
			hourlyRateMinor: 3000,
			markupPercent: 20
		});
		expect(working.lines.map((l) => l.id)).toEqual(['fabric', 'labour']);
		expect(working.lines[0].amountMinor).toBe(0);
		// 9.5 h × 30.00 = 285.00.
		expect(working.totalMinor).toBe(28500);
	});

	it('works in currencies without minor units (ISO 4217: JPY has none)', () => {
		const working = quoteWorking({
			currency: 'JPY',
			tailorSourcesFabric: true,
			fabricMetres: 2.5,
			fabricPricePerMetreMinor: 1800,
			labourHours: 4,
			hourlyRateMinor: 3500,
			markupPercent: 10
		});
		// 2.5 m × ¥1800 = ¥4500; 10 % = ¥450; 4 h × ¥3500 = ¥14000.
		expect(working.totalMinor).toBe(18950);
		expect(working.exponent).toBe(0);
	});

	it('reads nonsense figures (negative, not a number) as zero', () => {
		const working = quoteWorking({
			currency: 'EUR',
			tailorSourcesFabric: true,
			fabricMetres: Number.NaN,
			fabricPricePerMetreMinor: -5,
			labourHours: -2,
			hourlyRateMinor: 2800,
			markupPercent: 10
		});
		expect(working.totalMinor).toBe(0);
	});
});

describe('the helper pre-fill', () => {
	const band = [
		{ dimension: 'waist_girth', lowerMm: 720, upperMm: 760 },
		{ dimension: 'hip_girth', lowerMm: 980, upperMm: 1020 }
	];
	const rates = {
		hourlyRateMinor: 2800,
		currency: 'EUR',
		labourHours: { 'straight-skirt': 6 },
		fabricMarkupPercent: 15
	};

	it("starts from the size band's fabric estimate and the workroom's own rates", () => {
		const estimate = fabricEstimateForBand('straight-skirt', band, 'cm');
		expect(estimate).not.toBeNull();
		const metres = Number(/^(\d+(?:\.\d+)?) m$/.exec(estimate!.length)![1]);
		const { input, working, leadDays } = prefill({
			garmentType: 'straight-skirt',
			sizeBand: band,
			fabricSource: 'tailor_sources',
			currency: 'EUR',
			rates,
			leadTimes: { 'straight-skirt': 12 }
		});
		expect(input).toEqual({
			currency: 'EUR',
			tailorSourcesFabric: true,
			fabricMetres: metres,
			fabricPricePerMetreMinor: startingFabricPricePerMetre * 100,
			labourHours: 6,
			hourlyRateMinor: 2800,
			markupPercent: 15
		});
		expect(working.totalMinor).toBe(quoteWorking(input).totalMinor);
		expect(leadDays).toBe(12);
	});

	it('asks for a rate in the commission’s currency rather than converting one', () => {
		const { input, notes } = prefill({
			garmentType: 'straight-skirt',
			sizeBand: band,
			fabricSource: 'customer_supplies',
			currency: 'GBP',
			rates,
			leadTimes: {}
		});
		expect(input.hourlyRateMinor).toBe(0);
		expect(input.tailorSourcesFabric).toBe(false);
		expect(notes.join(' ')).toContain('enter your rate in GBP');
	});

	it("falls back to the garment's usual hours when the workroom has none for it", () => {
		const { input, notes, leadDays } = prefill({
			garmentType: 'wide-leg-trousers',
			sizeBand: band,
			fabricSource: 'tailor_sources',
			currency: 'EUR',
			rates,
			leadTimes: {}
		});
		expect(input.labourHours).toBeGreaterThan(0);
		expect(notes.some((n) => n.includes('the usual time for this garment'))).toBe(true);
		// The usual lead time for trousers (common practice, see commissions/lead-times.ts).
		expect(leadDays).toBe(21);
	});

	it('prices a lined waistcoat’s lining from its own layout, on a line of its own', () => {
		const lining = liningEstimateForBand('waistcoat', band, 'cm');
		expect(lining).not.toBeNull();
		const metres = Number(/^(\d+(?:\.\d+)?) m$/.exec(lining!.length!)![1]);
		const { input, working, notes } = prefill({
			garmentType: 'waistcoat',
			sizeBand: band,
			fabricSource: 'customer_supplies',
			currency: 'EUR',
			rates,
			leadTimes: {}
		});
		expect(input.lining).toEqual({ metres, pricePerMetreMinor: startingLiningPricePerMetre * 100 });
		const line = working.lines.find((l) => l.id === 'lining')!;
		// Lining metres × the lining price, rounded half up once (cost-plus pricing, common practice).
		expect(line.amountMinor).toBe(Math.round(metres * startingLiningPricePerMetre * 100));
		expect(notes.some((n) => n.startsWith(`Lining: ${lining!.length}`))).toBe(true);
	});

	it('has no lining for an unlined garment', () => {
		expect(liningEstimateForBand('straight-skirt', band, 'cm')).toBeNull();
		const { input, working } = prefill({
			garmentType: 'straight-skirt',
			sizeBand: band,
			fabricSource: 'tailor_sources',
			currency: 'EUR',
			rates,
			leadTimes: {}
		});
		expect(input.lining).toBeUndefined();
		expect(working.lines.some((l) => l.id === 'lining')).toBe(false);
	});
});
