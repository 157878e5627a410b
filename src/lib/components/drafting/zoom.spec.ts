import { describe, expect, it } from 'vitest';
import { clampView, panBy, zoomAt } from './zoom';

const frame = { width: 300, height: 400 };

describe('drawing zoom', () => {
	it('keeps the point under the fingers fixed while zooming', () => {
		const at = { x: 100, y: 150 };
		const zoomed = zoomAt({ scale: 1, x: 0, y: 0 }, 2, at, frame);
		expect(zoomed).toEqual({ scale: 2, x: -100, y: -150 });
		// The content point (100, 150) still shows at (100, 150).
		expect(zoomed.x + 2 * 100).toBe(100);
		expect(zoomed.y + 2 * 150).toBe(150);
	});

	it('stays between 1× and 6× and never pulls empty space into the frame', () => {
		expect(zoomAt({ scale: 1, x: 0, y: 0 }, 0.5, { x: 10, y: 10 }, frame)).toEqual({ scale: 1, x: 0, y: 0 });
		expect(zoomAt({ scale: 1, x: 0, y: 0 }, 20, { x: 0, y: 0 }, frame).scale).toBe(6);
		expect(panBy({ scale: 2, x: 0, y: 0 }, 50, 50, frame)).toEqual({ scale: 2, x: 0, y: 0 });
		expect(panBy({ scale: 2, x: 0, y: 0 }, -1000, -1000, frame)).toEqual({ scale: 2, x: -300, y: -400 });
		expect(clampView({ scale: 1, x: -20, y: 30 }, frame)).toEqual({ scale: 1, x: 0, y: 0 });
	});
});
