/**
 * npm run bench — times the drafting core per garment: draftGarment (checks, template, fabric layout,
 * SVGs) and the fabric layout alone. Prints mean and p95 per call after a warm-up.
 */
import { performance } from 'node:perf_hooks';
import {
	draftGarment,
	estimateFabric,
	garments,
	getTemplate,
	packStrip,
	resolveOptions,
	toMm,
	type DraftRequest
} from '../src/lib/drafting/index';
import { hopperTurtonC1P1 } from '../src/lib/drafting/strip-packing-instances';

const warmUp = 200;
const iterations = 2000;

/** Bust, waist and hip: the EN 13402-3 pictogram body 88-72-96; the rest mid-range adult values. */
const bodyCm = {
	bust_girth: 88,
	under_bust_girth: 73,
	waist_girth: 72,
	hip_girth: 96,
	thigh_girth: 56,
	upper_arm_girth: 28,
	shoulder_width: 38,
	nape_to_waist: 41,
	shoulder_to_bust_point: 25,
	bust_point_span: 18,
	waist_to_hip: 20.6,
	waist_to_floor: 104,
	inside_leg: 78,
	stature: 168
};

function time(run: () => unknown): { mean: number; p95: number } {
	for (let i = 0; i < warmUp; i++) run();
	const samples = new Float64Array(iterations);
	for (let i = 0; i < iterations; i++) {
		const start = performance.now();
		run();
		samples[i] = performance.now() - start;
	}
	samples.sort();
	const mean = samples.reduce((sum, s) => sum + s, 0) / iterations;
	return { mean: mean * 1000, p95: samples[Math.floor(iterations * 0.95)] * 1000 };
}

const format = (us: number) => (us >= 1000 ? `${(us / 1000).toFixed(2)} ms` : `${us.toFixed(1)} µs`);
const rows: string[][] = [['garment', 'draftGarment mean', 'p95', 'layout mean', 'p95', 'yardage']];

for (const garment of garments) {
	const request: DraftRequest = { garment: garment.id, unit: 'cm', measurements: bodyCm, fabric: { width: 115 } };
	const response = draftGarment(request);
	if (response.errors.length) throw new Error(`${garment.id}: ${response.errors.map((e) => e.message).join('; ')}`);
	const full = time(() => draftGarment(request));
	const template = getTemplate(garment.id);
	const bodyMm = Object.fromEntries(Object.entries(bodyCm).map(([code, cm]) => [code, toMm(cm, 'cm')]));
	const pieces = template.draft(bodyMm, resolveOptions(template, {}, bodyMm, 'cm').options).pieces;
	const spec = { widthMm: 1150, folded: true, directional: false, shrinkagePercent: 0, repeatMm: 0 };
	const layout = time(() => estimateFabric(pieces, spec, 'cm'));
	rows.push([
		garment.id,
		format(full.mean),
		format(full.p95),
		format(layout.mean),
		format(layout.p95),
		response.fabric?.lengthDisplay ?? '—'
	]);
}

const c1p1 = hopperTurtonC1P1.items;
const strip = time(() => packStrip(c1p1, hopperTurtonC1P1.width));

const widths = rows[0].map((_, col) => Math.max(...rows.map((r) => r[col].length)));
console.log(`Tackline drafting bench — ${iterations} calls after ${warmUp} warm-up, Node ${process.version}\n`);
for (const [i, row] of rows.entries()) {
	console.log(row.map((cell, col) => cell.padEnd(widths[col])).join('  '));
	if (i === 0) console.log(widths.map((w) => '─'.repeat(w)).join('  '));
}
console.log(`\npackStrip on Hopper–Turton C1-P1 (16 items): mean ${format(strip.mean)}, p95 ${format(strip.p95)}`);
