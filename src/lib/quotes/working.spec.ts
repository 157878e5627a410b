import { describe, expect, it } from 'vitest';
import { quoteWorking } from './working';

// Cost-plus pricing as small workrooms quote (common practice): cloth and lining bought × their prices, a
// mark-up on the cloth the workroom buys, labour hours × the hourly rate. Expected figures are worked by hand.
describe('the quote helper working — a lined garment', () => {
	const unlined = {
		currency: 'EUR',
		tailorSourcesFabric: true,
		fabricMetres: 1.6,
		fabricPricePerMetreMinor: 2500,
		labourHours: 6,
		hourlyRateMinor: 2800,
		markupPercent: 15
	};

	it('adds lining metres × the lining price, and the mark-up on both cloths', () => {
		const working = quoteWorking({ ...unlined, lining: { metres: 1.2, pricePerMetreMinor: 900 } });
		// Fabric 1.6 m × 25.00 = 40.00; lining 1.2 m × 9.00 = 10.80; 15 % of 50.80 = 7.62; labour 6 h × 28.00 = 168.00.
		expect(working.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 4000],
			['lining', 1080],
			['markup', 762],
			['labour', 16800]
		]);
		expect(working.lines[1].detail).toBe('1.2 m × 9.00 EUR');
		expect(working.lines[2].label).toBe('Mark-up on fabric and lining');
		expect(working.totalMinor).toBe(4000 + 1080 + 762 + 16800);
	});

	it('charges the lining when the customer brings the cloth (the workroom buys the lining)', () => {
		const working = quoteWorking({
			...unlined,
			tailorSourcesFabric: false,
			lining: { metres: 1.2, pricePerMetreMinor: 900 }
		});
		// Fabric not charged; lining 10.80; 15 % of 10.80 = 1.62; labour 168.00.
		expect(working.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 0],
			['lining', 1080],
			['markup', 162],
			['labour', 16800]
		]);
		expect(working.lines[2].label).toBe('Mark-up on lining');
		expect(working.totalMinor).toBe(18042);
	});

	it('leaves an unlined garment’s working exactly as before', () => {
		const working = quoteWorking(unlined);
		expect(working.lines.map((l) => [l.id, l.amountMinor])).toEqual([
			['fabric', 4000],
			['markup', 600],
			['labour', 16800]
		]);
		expect(working.totalMinor).toBe(21400);
	});
});
