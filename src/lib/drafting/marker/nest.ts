/**
 * A marker: real piece outlines nested on the cloth. Each copy goes, in turn, to the lowest place along the
 * cloth (then the leftmost) where it touches nothing — the bottom-left rule — found exactly from no-fit
 * polygons (Art 1966; Burke, Hellier, Kendall & Whitwell, Operations Research 54(3), 2006) rather than
 * by sliding. Several orderings are tried within the budget and the shortest marker is kept.
 */
import { boundingBox, polygonArea, translate as shift, type Box, type Point } from '../geometry';
import {
	difference,
	lineOutside,
	noFitPolygon,
	translate,
	union,
	unitsPerMm,
	type Path64,
	type Paths64
} from './polygons';
import {
	applyLinear,
	compose,
	invert,
	variantsFor,
	type BaseShapes,
	type Linear,
	reflectAlong,
	type MarkerItem,
	type Turn,
	type Variant
} from './variants';

export type { MarkerItem, Turn };

export interface MarkerOptions {
	/** Width of the cloth as laid (half the width when folded), mm. */
	width: number;
	/** Space left between pieces for the cutting line, mm. */
	gapMm?: number;
	/** How far the nesting shape may stray from a curve, mm. */
	toleranceMm?: number;
	/** Every piece starts on a multiple of this (pattern repeat), 0 for none. */
	yStep?: number;
	/** Orderings to try at most. */
	orderings?: number;
	/** No new ordering starts after this; with nothing finished by then there is no marker. */
	budgetMs?: number;
	/** Clock for the budget, ms. */
	now?: () => number;
}

export interface MarkerPlacement {
	item: number;
	copy: number;
	turn: Turn;
	mirrored: boolean;
	/** Cutting line on the cloth, mm, fold at x = 0. */
	outline: Point[];
	grainline: [Point, Point];
	box: Box;
}

export interface MarkerResult {
	width: number;
	length: number;
	placements: MarkerPlacement[];
	/** Σ outline area ÷ (width × length). */
	efficiency: number;
	/** Σ outline area ÷ width: no marker can be shorter. */
	areaBound: number;
	orderingsTried: number;
	/** The marker was laid from the far end (and reflected back). */
	fromFarEnd: boolean;
}

export const defaultGapMm = 2;
export const flatteningToleranceMm = 1;
/**
 * Orderings tried at most: the fixed ones, then neighbours of the best so far. With the draft's budget the clock
 * usually ends the search first; a small garment stops here.
 */
export const defaultOrderings = 3000;
/** Neighbours tried in a row without a shorter marker before the search restarts from a shuffled ordering. */
const patience = 60;

interface Unit {
	item: number;
	copy: number;
	variants: Variant[];
	onFold: boolean;
	area: number;
	/** A pair on open cloth: at most this many copies of the item in each hand (either may come first). */
	perHand?: number;
	/** Set when the search holds this copy to one variant: all it may take. */
	free?: Variant[];
}

interface Placed {
	unit: Unit;
	variant: Variant;
	x: number;
	y: number;
}

interface Context {
	width: number;
	yStep: number;
	yLimit: number;
	nfps: Map<Variant, Map<Variant, Paths64>>;
	/** No-fit polygons between two items as drafted, one per relative turn or mirror. */
	baseNfps: Map<BaseShapes, Map<BaseShapes, Map<string, Paths64>>>;
}

/**
 * No-fit polygon of `moving` round `fixed` with both as drafted but `moving` under the relative map:
 * overlap, or a curve of either within the cutting gap of the other (straight runs may share a cut line).
 */
function baseNoFit(context: Context, fixed: BaseShapes, moving: BaseShapes, relative: Linear): Paths64 {
	let row = context.baseNfps.get(fixed);
	if (!row) context.baseNfps.set(fixed, (row = new Map<BaseShapes, Map<string, Paths64>>()));
	let cell = row.get(moving);
	if (!cell) row.set(moving, (cell = new Map<string, Paths64>()));
	const key = relative.join(',');
	let nfp = cell.get(key);
	// A ⊕ −(R·B) = −R·(B ⊕ −(R⁻¹·A)): the polygon the other way round, if known, only needs mapping.
	const back = invert(relative);
	const known = nfp ? undefined : context.baseNfps.get(moving)?.get(fixed)?.get(back.join(','));
	if (known) {
		const negated: Linear = [-relative[0], -relative[1], -relative[2], -relative[3]];
		nfp = known.map((p) => applyLinear(negated, p));
		cell.set(key, nfp);
	}
	if (!nfp) {
		const shape = applyLinear(relative, moving.shape);
		nfp =
			fixed.clear === fixed.shape && moving.clear === moving.shape
				? noFitPolygon(fixed.shape, shape)
				: union([
						...noFitPolygon(fixed.clear, shape),
						...noFitPolygon(fixed.shape, applyLinear(relative, moving.clear))
					]);
		cell.set(key, nfp);
	}
	return nfp;
}

function noFit(context: Context, fixed: Variant, moving: Variant): Paths64 {
	let row = context.nfps.get(fixed);
	if (!row) context.nfps.set(fixed, (row = new Map<Variant, Paths64>()));
	let nfp = row.get(moving);
	if (!nfp) {
		// fixed = F·A + f and moving = V·B + v, so fixed ⊕ −moving = F·(A ⊕ −(F⁻¹V)·B) + f − v: one polygon per
		// relative map serves every pair of variants with that map.
		const relative = compose(invert(fixed.linear), moving.linear);
		const dx = fixed.offset.x - moving.offset.x;
		const dy = fixed.offset.y - moving.offset.y;
		nfp = baseNoFit(context, fixed.base, moving.base, relative).map((p) => applyLinear(fixed.linear, p, dx, dy));
		row.set(moving, nfp);
	}
	return nfp;
}

/** Per variant: the positions it may not take among the first `upTo` placed pieces. */
type Blocked = Map<Variant, { upTo: number; blocked: Paths64 }>;

const stepUp = (y: number, step: number) => Math.ceil(y / step - 1e-9) * step;

/** Lowest, then leftmost, free reference positions for one variant among the placed pieces. */
function candidates(context: Context, placed: Placed[], unit: Unit, variant: Variant, seen: Blocked): Point[] {
	const { width, yStep, yLimit } = context;
	// Copies of one item share their variants, so the region they may not take grows by the pieces placed since.
	const known = seen.get(variant);
	const fresh = placed.slice(known?.upTo ?? 0).flatMap((p) => translate(noFit(context, p.variant, variant), p.x, p.y));
	const blocked = known && !fresh.length ? known.blocked : union([...(known?.blocked ?? []), ...fresh]);
	seen.set(variant, { upTo: placed.length, blocked });
	// The fold, the selvedges and the cut end need no gap: the piece's own edge is the cut line there.
	const top = 0;
	if (unit.onFold) {
		if (variant.width > width) return [];
		return lineOutside({ x: 0, y: top }, { x: 0, y: yLimit }, blocked).flatMap((segment) => {
			const [a, b] = [Math.min(segment[0].y, segment[1].y), Math.max(segment[0].y, segment[1].y)];
			const y = yStep > 0 ? stepUp(a + variant.topInset, yStep) - variant.topInset : a;
			return y <= b ? [{ x: 0, y }] : [];
		});
	}
	const left = 0;
	const right = width - variant.width;
	if (right < left) return [];
	if (yStep > 0) {
		// The cutting line's top, not the grown shape's, lands on the repeat.
		for (let y = stepUp(top + variant.topInset, yStep) - variant.topInset; y <= yLimit; y += yStep) {
			const free = lineOutside({ x: left, y }, { x: right, y }, blocked);
			if (free.length) return free.map((s) => ({ x: Math.min(s[0].x, s[1].x), y }));
		}
		return [];
	}
	const room: Path64 = [
		{ x: left, y: top },
		{ x: right, y: top },
		{ x: right, y: yLimit },
		{ x: left, y: yLimit }
	];
	// A piece as wide as the room can only sit on a vertical line.
	if (right === left) {
		return lineOutside({ x: left, y: top }, { x: left, y: yLimit }, blocked).map((s) => ({
			x: left,
			y: Math.min(s[0].y, s[1].y)
		}));
	}
	return difference([room], blocked).flat();
}

/**
 * How a copy's place is chosen among the free ones: bottom-left by the far end ('far': the lower far end
 * wins), by the near end ('near': fills gaps first), or the place that lengthens the marker least, then the
 * lowest ('least'); ties go to the position nearer the fold or the left selvedge.
 */
type Rule = 'far' | 'near' | 'least';
const rules: readonly Rule[] = ['far', 'near', 'least'];

function better(rule: Rule, c: Point, variant: Variant, best: Placed, reach: number): boolean {
	if (rule === 'least') {
		const grows = Math.max(reach, c.y + variant.height);
		const bestGrows = Math.max(reach, best.y + best.variant.height);
		if (grows !== bestGrows) return grows < bestGrows;
		if (c.y !== best.y) return c.y < best.y;
		return c.x < best.x;
	}
	const key = rule === 'near' ? c.y : c.y + variant.height;
	const bestKey = rule === 'near' ? best.y : best.y + best.variant.height;
	return key < bestKey || (key === bestKey && c.x < best.x);
}

/**
 * Lays the copies in order. Null when one cannot be laid, the budget runs out, or the shapes already reach
 * `giveUpAt` (shape units): that ordering can no longer beat the best marker so far. The first copies may come
 * already laid (`prefix`): bottom-left lays the same copies in the same order in the same places.
 */
function placeAll(
	context: Context,
	units: Unit[],
	rule: Rule,
	overdue: () => boolean,
	giveUpAt = Infinity,
	prefix: readonly Placed[] = []
): Placed[] | null {
	const placed: Placed[] = [...prefix];
	const seen: Blocked = new Map();
	const hands = new Map<string, number>();
	const handKey = (item: number, mirrored: boolean) => `${item}|${mirrored}`;
	for (const p of prefix) {
		const key = handKey(p.unit.item, p.variant.mirrored);
		hands.set(key, (hands.get(key) ?? 0) + 1);
	}
	// How far down the cloth the grown shapes placed so far reach.
	let reach = prefix.reduce((max, p) => Math.max(max, p.y + p.variant.height), 0);
	for (const unit of units.slice(prefix.length)) {
		if (overdue()) return null;
		let best: Placed | null = null;
		for (const variant of unit.variants) {
			if (unit.perHand !== undefined && (hands.get(handKey(unit.item, variant.mirrored)) ?? 0) >= unit.perHand)
				continue;
			for (const c of candidates(context, placed, unit, variant, seen)) {
				if (!best || better(rule, c, variant, best, reach)) {
					best = { unit, variant, x: c.x, y: c.y };
				}
			}
		}
		if (!best) return null;
		placed.push(best);
		if (best.y + best.variant.height >= giveUpAt) return null;
		const key = handKey(unit.item, best.variant.mirrored);
		hands.set(key, (hands.get(key) ?? 0) + 1);
		reach = Math.max(reach, best.y + best.variant.height);
	}
	return placed;
}

function placedOutline(p: Placed): { outline: Point[]; grainline: [Point, Point] } {
	const dx = p.x / unitsPerMm + p.variant.shift.x;
	const dy = p.y / unitsPerMm + p.variant.shift.y;
	return {
		outline: shift(p.variant.outline, dx, dy),
		grainline: shift(p.variant.grainline, dx, dy) as [Point, Point]
	};
}

function markerLength(placed: Placed[]): number {
	return placed.reduce((max, p) => {
		const { outline } = placedOutline(p);
		return Math.max(max, boundingBox(outline).y + boundingBox(outline).height);
	}, 0);
}

type Order = (a: Unit, b: Unit) => number;
const biggest = (u: Unit) => Math.max(...u.variants.map((v) => v.width * v.height));
const tallest = (u: Unit) => Math.max(...u.variants.map((v) => v.height));
const widest = (u: Unit) => Math.max(...u.variants.map((v) => v.width));
const orders: Order[] = [
	// As given: the marker's items come in the order the rectangle layout laid them.
	() => 0,
	(a, b) => Number(b.onFold) - Number(a.onFold) || b.area - a.area,
	(a, b) => b.area - a.area,
	(a, b) => tallest(b) - tallest(a),
	(a, b) => biggest(b) - biggest(a),
	(a, b) => widest(b) - widest(a)
];

/** A fixed pseudo-random sequence (a linear congruential generator), so results repeat run to run. */
function random(): (n: number) => number {
	let seed = 0x2545f491;
	return (n) => {
		seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
		return (seed >>> 8) % n;
	};
}

/**
 * A neighbour of an ordering, and how many copies at its head it keeps as they were: one copy moves to any other
 * place in the order (a facing laid just before its own piece can nest into it), two near copies swap places
 * (the fold pieces stay where the ordering put them), or one copy is held to one of its allowed turns and
 * hands — bottom-left takes the first of equally low places, so the turn that would leave room for a later
 * piece is otherwise never tried — or let free again.
 */
function neighbour(order: readonly Unit[], pick: (n: number) => number): { order: Unit[]; same: number } {
	const next = [...order];
	const i = pick(next.length);
	const move = pick(3);
	if (move === 2) {
		const [unit] = next.splice(i, 1);
		const k = pick(next.length + 1);
		next.splice(k, 0, unit);
		return { order: next, same: Math.min(i, k) };
	}
	if (move === 0) {
		const j = (i + 1 + pick(3)) % next.length;
		if (next[i].onFold === next[j].onFold) [next[i], next[j]] = [next[j], next[i]];
		return { order: next, same: Math.min(i, j) };
	}
	const unit = next[i];
	const all = unit.free ?? unit.variants;
	if (all.length < 2) return { order: next, same: next.length };
	const k = pick(all.length + 1);
	next[i] = k === all.length ? { ...unit, variants: all, free: undefined } : { ...unit, variants: [all[k]], free: all };
	return { order: next, same: i };
}

interface Attempt {
	order: Unit[];
	rule: Rule;
	/** Laid with every piece reflected end to end; reflected back as a whole when kept. */
	fromFarEnd: boolean;
}

/** The units with their variants reflected end to end, and the way back to the variants as given. */
function reflectedUnits(sets: readonly Unit[][]) {
	const original = new Map<Variant, Variant>();
	const reflected = new Map<Variant, Variant>();
	const reflect = (v: Variant) => {
		let r = reflected.get(v);
		if (!r) {
			r = reflectAlong(v);
			reflected.set(v, r);
			original.set(r, v);
		}
		return r;
	};
	const units = sets.map((set) =>
		set.map((u) => ({ ...u, variants: u.variants.map(reflect), free: u.free?.map(reflect) }))
	);
	return { units, original };
}

/** A layout of reflected variants, reflected back end to end: the same marker, every piece as given. */
function reflectBack(placed: readonly Placed[], original: ReadonlyMap<Variant, Variant>): Placed[] {
	const end = Math.max(...placed.map((p) => p.y + p.variant.height));
	return placed.map((p) => ({ ...p, variant: original.get(p.variant)!, y: end - p.y - p.variant.height }));
}

/** Nests the items on the cloth. Null when a piece cannot fit the width or the budget ran out first. */
export function nestMarker(items: readonly MarkerItem[], options: MarkerOptions): MarkerResult | null {
	const now = options.now ?? (() => performance.now());
	const started = now();
	const gap = options.gapMm ?? defaultGapMm;
	const tolerance = options.toleranceMm ?? flatteningToleranceMm;
	const units: Unit[] = [];
	items.forEach((item, index) => {
		const [plain, mirrored] = variantsFor(item, tolerance, gap);
		const area = polygonArea(item.outline);
		// A pair on open cloth: half the copies in each hand, whichever is laid first.
		const paired = item.mirrorPairs && !item.eitherHand && item.quantity > 1;
		for (let copy = 0; copy < item.quantity; copy++) {
			const variants = paired ? [...plain, ...mirrored] : copy % 2 && item.mirrorPairs ? mirrored : plain;
			const perHand = paired ? Math.ceil(item.quantity / 2) : undefined;
			units.push({ item: index, copy, variants, onFold: item.onFold, area, perHand });
		}
	});
	if (!units.length) return null;
	const context: Context = {
		width: Math.round(options.width * unitsPerMm),
		yStep: Math.round((options.yStep ?? 0) * unitsPerMm),
		yLimit: units.reduce((sum, u) => sum + Math.max(...u.variants.map((v) => Math.max(v.width, v.height))), 0) * 2,
		nfps: new Map(),
		baseNfps: new Map()
	};
	const maxAttempts = options.orderings ?? defaultOrderings;
	const budget = options.budgetMs ?? Infinity;
	const overdue = () => now() - started > budget;
	let best: Placed[] | null = null;
	let bestLength = Infinity;
	let bestAttempt: Attempt = { order: units, rule: 'far', fromFarEnd: false };
	let tried = 0;
	let sinceBetter = 0;
	// Each fixed ordering with each rule, first with every variant open, then with every piece that may turn
	// held turned (end for end, or across for a band): turning one piece alone seldom gains, and the search
	// below changes one piece at a time.
	const turnedOnly = units.map((u) => {
		const turned = u.variants.filter((v) => v.turn !== 0);
		return turned.length ? { ...u, variants: turned, free: u.variants } : u;
	});
	// With each pair's other hand first: of two equally low places, bottom-left takes the first hand's.
	const otherHandFirst = units.map((u) =>
		u.perHand === undefined
			? u
			: { ...u, variants: [...u.variants.filter((v) => v.mirrored), ...u.variants.filter((v) => !v.mirrored)] }
	);
	// The same again laid from the far end (pieces reflected end to end, the layout reflected back), which
	// puts small pieces first into the hollows at the other end of the big ones; not with a pattern repeat,
	// whose steps count from the cut end.
	const fromFarEnd = !context.yStep ? reflectedUnits([units, turnedOnly, otherHandFirst]) : null;
	const starts: Array<{ units: Unit[]; fromFarEnd: boolean }> = [
		{ units, fromFarEnd: false },
		{ units: turnedOnly, fromFarEnd: false },
		{ units: otherHandFirst, fromFarEnd: false },
		...(fromFarEnd ? fromFarEnd.units.map((u) => ({ units: u, fromFarEnd: true })) : [])
	];
	const fixed = starts.length * orders.length * rules.length;
	const pick = random();
	// The local search's own best; after `patience` neighbours without a shorter marker it restarts from a
	// shuffled ordering (a fixed seed, so results repeat), while the overall best is kept.
	let current: { attempt: Attempt; length: number; placed: Placed[] } = {
		attempt: bestAttempt,
		length: Infinity,
		placed: []
	};
	while (tried < maxAttempts && (tried === 0 || !overdue())) {
		let attempt: Attempt;
		let restart = false;
		// Copies the attempt lays exactly as the current one did: the same units in the same order, so the same places.
		let prefix: Placed[] = [];
		if (tried < fixed) {
			const start = starts[Math.floor(tried / (orders.length * rules.length))];
			const n = tried % (orders.length * rules.length);
			attempt = {
				order: [...start.units].sort(orders[Math.floor(n / rules.length)]),
				rule: rules[n % rules.length],
				fromFarEnd: start.fromFarEnd
			};
		} else if (sinceBetter >= patience) {
			const farEnd = fromFarEnd !== null && pick(2) === 1;
			const order = [...(farEnd ? fromFarEnd.units[0] : units)];
			for (let i = order.length - 1; i > 0; i--) {
				const j = pick(i + 1);
				[order[i], order[j]] = [order[j], order[i]];
			}
			attempt = { order, rule: rules[pick(rules.length)], fromFarEnd: farEnd };
			restart = true;
			sinceBetter = 0;
		} else {
			const next = neighbour(current.attempt.order, pick);
			attempt = { ...current.attempt, order: next.order };
			prefix = current.placed.slice(0, next.same);
			sinceBetter++;
		}
		tried++;
		// A shape reaches at most a millimetre or so past its cutting line (the flattening's stray, rounding).
		const giveUpAt = restart ? Infinity : Math.min(current.length, bestLength) * unitsPerMm + 2 * unitsPerMm;
		const placed = placeAll(context, attempt.order, attempt.rule, overdue, giveUpAt, prefix);
		if (!placed) continue;
		const length = markerLength(placed);
		if (restart || length < current.length - 1e-6) {
			current = { attempt, length, placed };
			if (!restart) sinceBetter = 0;
		}
		if (length < bestLength - 1e-6) {
			best = placed;
			bestLength = length;
			bestAttempt = attempt;
		}
	}
	if (!best) return null;
	if (bestAttempt.fromFarEnd && fromFarEnd) best = reflectBack(best, fromFarEnd.original);
	const width = options.width;
	// The shapes are held to a hundredth of a millimetre: a cutting line may start that much before the cut end.
	const before = Math.max(0, ...best.map((p) => -boundingBox(placedOutline(p).outline).y));
	const placements = best
		.map((p): MarkerPlacement => {
			const laid = placedOutline(p);
			const outline = shift(laid.outline, 0, before);
			const grainline = shift(laid.grainline, 0, before) as [Point, Point];
			return {
				item: p.unit.item,
				copy: p.unit.copy,
				turn: p.variant.turn,
				mirrored: p.variant.mirrored,
				outline,
				grainline,
				box: boundingBox(outline)
			};
		})
		.sort((a, b) => a.item - b.item || a.copy - b.copy);
	const area = units.reduce((sum, u) => sum + u.area, 0);
	// Read off the cutting lines as laid (a marker laid from the far end was reflected back on the shapes' grid).
	const length = Math.max(...placements.map((p) => p.box.y + p.box.height));
	return {
		width,
		length,
		placements,
		efficiency: area / (width * length),
		areaBound: area / width,
		orderingsTried: tried,
		fromFarEnd: bestAttempt.fromFarEnd
	};
}
