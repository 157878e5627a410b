/**
 * npm run bench:marker — the marker (real outlines nested) against the rectangle layout, per garment, on
 * 115 cm cloth folded and open, plain and with nap: marker cloth used, rectangle cloth used, the area bound
 * (no marker can be shorter), and the time the marker took (mean of three runs after one, with the draft
 * API's budget unless `--budget` says otherwise): wall clock and this process's CPU time (on a shared machine
 * the CPU time is the steadier figure). The marker shown is the first run's, the one a draft request gets.
 * Targets: the marker uses more of the cloth than the rectangles on every garment, is never shorter than
 * the area bound, and takes at most 2 s a garment. Lined garments also show their lining marker.
 * Where the marker is not shorter, the row says whether the rectangles are already as short as any layout can
 * be: no shorter than the longest piece, or than the two pieces that need the most cloth on their own
 * (`marker/bound.ts`, exact for two pieces).
 *
 *   npm run bench:marker [-- --garment waistcoat] [-- --width 150] [-- --gap 0] [-- --budget 2000]
 *
 * `--gap` sets the cutting gap between pieces (default the marker's own); the rectangles have none, so a
 * run at 0 shows how much of a loss on an already tight rectangle layout is the gap alone.
 */
import { performance } from 'node:perf_hooks';
import {
	estimateFabric,
	garments,
	getTemplate,
	resolveOptions,
	toMm,
	type FabricEstimate,
	type FabricSpec
} from '../src/lib/drafting/index';
import { loadavg } from 'node:os';
import { defaultGapMm, draftNestBudget, markerItems, nestFabricEstimate } from '../src/lib/drafting/marker/index';
import { pairBound, type PairBound } from '../src/lib/drafting/marker/bound';
import { liningSpecOf } from '../src/lib/drafting/fabric';
import type { DraftPiece } from '../src/lib/drafting/pieces';

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

const args = process.argv.slice(2);
const argOf = (name: string) => {
	const i = args.indexOf(`--${name}`);
	return i >= 0 ? args[i + 1] : undefined;
};
const only = argOf('garment');
const widthCm = Number(argOf('width') ?? 115);
const gapMm = argOf('gap') === undefined ? undefined : Number(argOf('gap'));
/** `--budget ms` (or `--budget Infinity`): no new ordering after it; default the draft API's own budget. */
const budgetMs = argOf('budget') === undefined ? draftNestBudget.budgetMs : Number(argOf('budget'));

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;
const cm = (mm: number) => `${(mm / 10).toFixed(1)}`;

const rows: string[][] = [
	[
		'garment',
		'cloth',
		'rect cm',
		'marker cm',
		'area bound',
		'longest',
		'pair bound',
		'rect used',
		'marker used',
		'time',
		'cpu',
		'verdict'
	]
];
let failures = 0;

/** The shapes are held to a hundredth of a millimetre, and the pair bound errs that much short. */
const grid = 0.02;

function row(
	garment: string,
	cloth: string,
	boxes: FabricEstimate,
	nested: FabricEstimate,
	pair: PairBound | null,
	ms: number,
	cpuMs: number
) {
	// Σ cut area ÷ lay width: the cloth used, over the rectangles' length, is exactly that area.
	const bound = nested.nested?.areaBoundMm ?? boxes.efficiency * boxes.packedMm;
	// No layout is shorter than its longest piece either (OPT ≥ max(A/W, h_max), the trivial strip-packing bound),
	// nor than any two of its pieces need on their own (the pair bound, exact for two pieces).
	const tallest = Math.max(...boxes.placements.map((p) => p.h));
	const wins = nested.efficiency > boxes.efficiency + 1e-9;
	const atLongest = boxes.packedMm <= tallest + 1e-6;
	const atPair = pair !== null && boxes.packedMm <= pair.length + grid;
	const sound =
		nested.packedMm >= bound - 1e-6 &&
		nested.packedMm >= tallest - 1e-6 &&
		nested.packedMm >= (pair?.length ?? 0) - grid;
	const fast = ms <= 2000;
	const verdict = [
		wins
			? 'better'
			: atLongest
				? `at the lower bound: ${cm(boxes.packedMm)} cm = longest piece ${cm(tallest)} cm`
				: atPair
					? `at the lower bound: ${cm(boxes.packedMm)} cm = ${pair.pieces.join(' + ')} on their own`
					: 'NOT BETTER',
		sound ? '' : 'BELOW BOUND',
		fast ? '' : 'SLOW'
	]
		.filter(Boolean)
		.join(' ');
	if ((!wins && !atLongest && !atPair) || !sound || !fast) failures++;
	rows.push([
		garment,
		cloth,
		cm(boxes.packedMm),
		nested.nested ? cm(nested.packedMm) : 'boxes kept',
		cm(bound),
		cm(tallest),
		pair ? cm(pair.length) : '–',
		pct(boxes.efficiency),
		pct(nested.efficiency),
		`${ms.toFixed(0)} ms`,
		`${cpuMs.toFixed(0)} ms`,
		verdict
	]);
}

function boundOf(boxes: FabricEstimate, pieces: readonly DraftPiece[], spec: FabricSpec): PairBound | null {
	const items = markerItems(boxes, pieces, spec);
	return items
		? pairBound(
				items.map((g) => g.item),
				boxes.layWidthMm
			)
		: null;
}

for (const garment of garments) {
	if (only && garment.id !== only) continue;
	const template = getTemplate(garment.id);
	const bodyMm = Object.fromEntries(Object.entries(bodyCm).map(([code, v]) => [code, toMm(v, 'cm')]));
	const pieces = template.draft(bodyMm, resolveOptions(template, {}, bodyMm, 'cm').options).pieces;
	for (const folded of [true, false]) {
		for (const directional of [false, true]) {
			const spec: FabricSpec = { widthMm: widthCm * 10, folded, directional, shrinkagePercent: 0, repeatMm: 0 };
			const boxes = estimateFabric(pieces, spec, 'cm').estimate!;
			const runs = [0, 1, 2, 3].map(() => {
				const start = performance.now();
				const cpu = process.cpuUsage();
				const nested = nestFabricEstimate(boxes, pieces, spec, { budgetMs, gapMm });
				const used = process.cpuUsage(cpu);
				return { ms: performance.now() - start, cpuMs: (used.user + used.system) / 1000, nested };
			});
			const ms = runs.slice(1).reduce((sum, r) => sum + r.ms, 0) / 3;
			const cpuMs = runs.slice(1).reduce((sum, r) => sum + r.cpuMs, 0) / 3;
			const { nested } = runs[0];
			const cloth = `${boxes.folded ? 'folded' : 'open'}${directional ? ', nap' : ''}`;
			row(garment.id, cloth, boxes, nested, boundOf(boxes, pieces, spec), ms, cpuMs);
			if (boxes.lining?.estimate && nested.lining?.estimate && !directional) {
				const liningPieces = pieces.filter((p) => p.cut.cloth === 'lining');
				row(
					`${garment.id} lining`,
					boxes.lining.estimate.folded ? 'folded' : 'open',
					boxes.lining.estimate,
					nested.lining.estimate,
					boundOf(boxes.lining.estimate, liningPieces, liningSpecOf(spec)),
					ms,
					cpuMs
				);
			}
		}
	}
}

const widths = rows[0].map((_, col) => Math.max(...rows.map((r) => r[col].length)));
console.log(
	`Marker vs rectangles on ${widthCm} cm cloth, cutting gap ${gapMm ?? defaultGapMm} mm, budget ${budgetMs} ms, ` +
		`Node ${process.version}, load average ${loadavg()[0].toFixed(1)} at the start (time: whole garment, lining included)\n`
);
for (const [i, r] of rows.entries()) {
	console.log(r.map((cell, col) => cell.padEnd(widths[col])).join('  '));
	if (i === 0) console.log(widths.map((w) => '─'.repeat(w)).join('  '));
}
console.log(failures ? `\n${failures} row(s) miss a target.` : '\nEvery row meets the targets.');
