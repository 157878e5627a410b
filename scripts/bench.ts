/**
 * npm run bench — times the drafting core per garment: the draft as the calculator makes it (checks,
 * template, box layout, SVGs) and the box layout alone, mean and p95 per call after a warm-up; then the
 * marker (real outlines nested) per garment on folded and open cloth against the box layout: time,
 * length and cloth used. Target: the marker under 2 s a garment and never behind the boxes.
 *
 * Then the search bench (`npm run bench:search`, scripts/bench-http.ts --search): its own database with
 * 10 000 open commissions and 1 000 workrooms, the tailor's near-me page (SSR) and the search API at 50
 * connections beside a node:http + pg baseline answering the same keyset query; req/s, p50 and p99.
 * Options after `--` go to it (--rounds, --seconds, --connections, --only, --profile); `--no-search`
 * runs the drafting part alone, `--search-only` the search part alone.
 */
import { spawnSync } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import {
	draftGarmentMm,
	draftInputFromRequest,
	estimateFabric,
	garments,
	getTemplate,
	packStrip,
	resolveOptions,
	toMm,
	type DraftRequest
} from '../src/lib/drafting/index';
import { nestFabricEstimate } from '../src/lib/drafting/marker/index';
import { hopperTurtonC1P1 } from '../src/lib/drafting/strip-packing-instances';

const passed = process.argv.slice(2);
const withSearch = !passed.includes('--no-search');
const searchOnly = passed.includes('--search-only');
const searchArgs = passed.filter((arg) => arg !== '--no-search' && arg !== '--search-only');

/** The search bench in a process of its own (it builds and starts the app, and loads it with autocannon). */
function searchBench() {
	console.log('\nSearch near me: npm run bench:search\n');
	const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/bench-http.ts', '--search', ...searchArgs], {
		stdio: 'inherit'
	});
	if (run.status !== 0) process.exitCode = run.status ?? 1;
}

if (searchOnly) {
	searchBench();
	process.exit();
}

const warmUp = 200;
const iterations = 2000;

/** Bust, waist and hip: the EN 13402-3 pictogram body 88-72-96; the rest mid-range adult values. */
const bodyCm = {
	neck_girth: 35,
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
	arm_length: 58,
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
const rows: string[][] = [['garment', 'draft mean', 'p95', 'box layout mean', 'p95', 'yardage']];
const markerRows: string[][] = [
	['garment', 'cloth', 'marker time', 'boxes length', 'marker length', 'boxes used', 'marker used', 'area bound']
];

for (const garment of garments) {
	const request: DraftRequest = { garment: garment.id, unit: 'cm', measurements: bodyCm, fabric: { width: 115 } };
	const input = draftInputFromRequest(request);
	const response = draftGarmentMm(input);
	if (response.errors.length) throw new Error(`${garment.id}: ${response.errors.map((e) => e.message).join('; ')}`);
	const full = time(() => draftGarmentMm(input));
	const template = getTemplate(garment.id);
	const bodyMm = Object.fromEntries(Object.entries(bodyCm).map(([code, cm]) => [code, toMm(cm, 'cm')]));
	const pieces = template.draft(bodyMm, resolveOptions(template, {}, bodyMm, 'cm').options).pieces;
	const spec = { widthMm: 1150, folded: true, directional: false, shrinkagePercent: 0, repeatMm: 0 };
	const layout = time(() => estimateFabric(pieces, spec, 'cm'));
	for (const folded of [true, false]) {
		const cloth = { ...spec, folded };
		const boxes = estimateFabric(pieces, cloth, 'cm').estimate!;
		const runs = [0, 1, 2, 3].map(() => {
			const start = performance.now();
			const nested = nestFabricEstimate(boxes, pieces, cloth, { budgetMs: Infinity });
			return { ms: performance.now() - start, nested };
		});
		const { nested } = runs[0];
		const ms = runs.slice(1).reduce((sum, r) => sum + r.ms, 0) / 3;
		markerRows.push([
			garment.id,
			folded ? 'folded' : 'open',
			`${ms.toFixed(0)} ms`,
			`${(boxes.packedMm / 10).toFixed(1)} cm`,
			nested.nested ? `${(nested.packedMm / 10).toFixed(1)} cm` : 'boxes kept',
			`${(boxes.efficiency * 100).toFixed(1)} %`,
			`${(nested.efficiency * 100).toFixed(1)} %`,
			nested.nested ? `${(nested.nested.areaBoundMm / 10).toFixed(1)} cm` : '—'
		]);
	}
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

function printTable(table: string[][]) {
	const widths = table[0].map((_, col) => Math.max(...table.map((r) => r[col].length)));
	for (const [i, row] of table.entries()) {
		console.log(row.map((cell, col) => cell.padEnd(widths[col])).join('  '));
		if (i === 0) console.log(widths.map((w) => '─'.repeat(w)).join('  '));
	}
}

console.log(`Tackline drafting bench — ${iterations} calls after ${warmUp} warm-up, Node ${process.version}\n`);
printTable(rows);
console.log('\nMarker on 115 cm cloth, mean of three runs after one (no budget; the draft API allows 2 s):\n');
printTable(markerRows);
console.log(`\npackStrip on Hopper–Turton C1-P1 (16 items): mean ${format(strip.mean)}, p95 ${format(strip.p95)}`);

if (withSearch) searchBench();
