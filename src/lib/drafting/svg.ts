import type { FabricEstimate } from './fabric';
import { boundingBox, type Box, type CurvedPath, type Point } from './geometry';
import type { DraftPiece, PieceMark } from './pieces';
import { placeDimensionLabels, textRect, type DimensionLabel, type Rect } from './svg-labels';
import { formatLength, mmPerMetre, mmPerYard, type Unit } from './units';

/* Pattern drawings in millimetre user units; strokes keep their screen width at any zoom. */

const ink = '#242733';
const madder = '#a93c25';
const woad = '#24495a';

const needsEscape = /[&<>"']/;

export function escapeXml(text: string): string {
	if (!needsEscape.test(text)) return text;
	return text.replace(
		/[&<>"']/g,
		(c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!
	);
}

/**
 * A coordinate to a tenth, as `(Math.round(value * 10) / 10).toString()` writes it ("12.3", "-0.5", "7"),
 * from whole numbers, which the engine turns into text much faster than fractions.
 */
export function n(value: number): string {
	const tenths = Math.round(value * 10);
	if (!(tenths > -1e15 && tenths < 1e15)) return (tenths / 10).toString(); // NaN, ±Infinity, huge
	const negative = tenths < 0;
	const abs = negative ? -tenths : tenths;
	const whole = Math.floor(abs / 10);
	const tenth = abs - whole * 10;
	const text = tenth === 0 ? `${whole}` : `${whole}.${tenth}`;
	return negative ? `-${text}` : text;
}

function points(list: readonly Point[]): string {
	let out = '';
	for (let i = 0; i < list.length; i++) out += `${i ? ' ' : ''}${n(list[i].x)},${n(list[i].y)}`;
	return out;
}

/** SVG path data for a closed outline: L for straight edges, Q for curved ones. */
export function pathData(path: CurvedPath): string {
	const xy = (p: Point) => `${n(p.x)},${n(p.y)}`;
	const steps = path.steps.map((s) => (s.control ? `Q${xy(s.control)} ${xy(s.to)}` : `L${xy(s.to)}`));
	return `M${xy(path.start)} ${steps.join(' ')} Z`;
}

function stroke(colour: string, width: number, dash?: string): string {
	return `stroke="${colour}" stroke-width="${width}" vector-effect="non-scaling-stroke"${dash ? ` stroke-dasharray="${dash}"` : ''} fill="none"`;
}

function text(
	at: Point,
	content: string,
	size: number,
	options: { anchor?: 'start' | 'middle' | 'end'; rotate?: number; weight?: number; colour?: string } = {}
): string {
	const rotate = options.rotate ? ` transform="rotate(${options.rotate} ${n(at.x)} ${n(at.y)})"` : '';
	const weight = options.weight ? ` font-weight="${options.weight}"` : '';
	return `<text x="${n(at.x)}" y="${n(at.y)}" font-size="${n(size)}" text-anchor="${options.anchor ?? 'middle'}" dominant-baseline="middle" fill="${options.colour ?? ink}"${weight}${rotate} paint-order="stroke" stroke="#fff" stroke-width="${n(size / 4)}">${escapeXml(content)}</text>`;
}

/** A small filled arrowhead at `tip`, pointing away from `from`. */
function arrowHead(from: Point, tip: Point, size: number, colour: string): string {
	const angle = Math.atan2(tip.y - from.y, tip.x - from.x);
	const a = { x: tip.x - size * Math.cos(angle - 0.4), y: tip.y - size * Math.sin(angle - 0.4) };
	const b = { x: tip.x - size * Math.cos(angle + 0.4), y: tip.y - size * Math.sin(angle + 0.4) };
	return `<polygon points="${points([tip, a, b])}" fill="${colour}"/>`;
}

/** A dimension line with arrows and its label where the label placer put it. */
function dimension(d: DimensionLabel): string {
	const { from, to } = d;
	return [
		`<line x1="${n(from.x)}" y1="${n(from.y)}" x2="${n(to.x)}" y2="${n(to.y)}" ${stroke(woad, 1)}/>`,
		arrowHead(to, from, d.fontSize * 0.7, woad),
		arrowHead(from, to, d.fontSize * 0.7, woad),
		text(d.at, d.text, d.fontSize, { rotate: d.rotate, colour: woad })
	].join('');
}

function mark(m: PieceMark, size: number): string {
	const line = `points="${points(m.points)}"`;
	switch (m.kind) {
		case 'dart':
			return `<polyline ${line} ${stroke(madder, 1.5)}/>`;
		case 'zip':
			return `<polyline ${line} ${stroke(madder, 3, '6 3')}/>${text({ x: m.points[0].x + size, y: (m.points[0].y + m.points[1].y) / 2 }, m.label ?? 'zip', size * 0.75, { rotate: -90, colour: madder })}`;
		case 'slit':
			return `<polyline ${line} ${stroke(madder, 2.5, '2 3')}/>`;
		case 'fold':
			return `<polyline ${line} ${stroke(ink, 1, '10 3 2 3')}/>`;
		default: {
			const label = m.label
				? text({ x: m.points[0].x + size * 0.3, y: m.points[0].y - size * 0.45 }, m.label, size * 0.65, {
						anchor: 'start',
						colour: '#5d6170'
					})
				: '';
			return `<polyline ${line} ${stroke('#7b7f8c', 1, '4 3')}/>${label}`;
		}
	}
}

function grainline([a, b]: [Point, Point], size: number): string {
	return [
		`<line x1="${n(a.x)}" y1="${n(a.y)}" x2="${n(b.x)}" y2="${n(b.y)}" ${stroke(ink, 1.5)}/>`,
		arrowHead(b, a, size * 0.8, ink),
		arrowHead(a, b, size * 0.8, ink),
		text({ x: a.x + size * 0.7, y: (a.y + b.y) / 2 }, 'grain', size * 0.75, { rotate: -90 })
	].join('');
}

/** The room the fold bracket and its words take. */
function foldRect(box: Box, size: number): Rect {
	return { x0: box.x, y0: box.y + box.height * 0.2, x1: box.x + size * 2.3, y1: box.y + box.height * 0.8 };
}

/** The usual "place on fold" bracket, drawn just inside the fold edge with arrows pointing at it. */
function foldMarker(box: Box, size: number): string {
	const x = box.x + size * 1.1;
	const top = box.y + box.height * 0.2;
	const bottom = box.y + box.height * 0.8;
	return [
		`<polyline points="${points([
			{ x: box.x, y: top },
			{ x, y: top },
			{ x, y: bottom },
			{ x: box.x, y: bottom }
		])}" ${stroke(madder, 1.5)}/>`,
		arrowHead({ x, y: top }, { x: box.x, y: top }, size * 0.6, madder),
		arrowHead({ x, y: bottom }, { x: box.x, y: bottom }, size * 0.6, madder),
		text({ x: x + size * 0.7, y: box.y + box.height / 2 }, 'place on fold', size * 0.75, {
			rotate: -90,
			colour: madder,
			weight: 600
		})
	].join('');
}

export function cutText(cut: DraftPiece['cut']): string {
	const from = cut.cloth === 'lining' ? ' in lining' : '';
	if (cut.onFold) return `Cut ${cut.quantity} on fold${from}`;
	if (cut.pair)
		return `Cut ${cut.quantity} (${cut.quantity / 2 === 1 ? 'a pair' : `${cut.quantity / 2} pairs`})${from}`;
	return `Cut ${cut.quantity}${from}`;
}

/** Piece name and cut instruction where no dimension, guide or grainline runs through them. */
function pieceLabel(piece: DraftPiece, box: Box, size: number): { svg: string; rect: Rect } {
	const name = piece.label.toUpperCase();
	const cut = cutText(piece.cut);
	if (box.height > 2.5 * box.width && box.width < size * 9) {
		const at = { x: box.x + box.width * 0.32, y: box.y + box.height / 2 };
		const small = Math.min(size * 1.2, box.width / 4);
		const nameRect = textRect(at, name, small, -90);
		return {
			svg:
				text(at, name, small, { weight: 700, rotate: -90 }) +
				text({ x: at.x + small * 1.3, y: at.y }, cut, small * 0.7, { rotate: -90 }),
			rect: { ...nameRect, x1: nameRect.x1 + small * 1.3 }
		};
	}
	const halfWidth = (Math.max(name.length * 1.2, cut.length * 0.85) * size * 0.62) / 2;
	const centreX = box.x + box.width / 2;
	const busyYs = [
		...piece.lines.flatMap((l) =>
			l.dimension && Math.abs(l.dimension.from.y - l.dimension.to.y) < size ? [l.dimension.from.y] : []
		),
		...piece.marks.filter((m) => m.kind === 'guide').map((m) => m.points[0].y)
	];
	const [g0, g1] = piece.grainline;
	const grainCrosses = Math.abs(g0.x - centreX) < halfWidth + size;
	const clear = (y: number) => {
		const top = y - size * 1.1;
		const bottom = y + size * 2.3;
		if (busyYs.some((busy) => busy > top - size * 0.5 && busy < bottom + size * 0.5)) return false;
		return !(grainCrosses && Math.max(g0.y, g1.y) > top - size && Math.min(g0.y, g1.y) < bottom + size);
	};
	const fractions = [0.42, 0.32, 0.52, 0.25, 0.62, 0.72, 0.18, 0.82];
	const y = box.y + box.height * (fractions.find((f) => clear(box.y + box.height * f)) ?? 0.42);
	return {
		svg:
			text({ x: centreX, y }, name, size * 1.2, { weight: 700 }) +
			text({ x: centreX, y: y + size * 1.5 }, cut, size * 0.85),
		rect: { x0: centreX - halfWidth, y0: y - size * 0.8, x1: centreX + halfWidth, y1: y + size * 2.1 }
	};
}

/** A piece drawing's box on a 360 px phone, px: the card's inner width and the drawing's height limit. */
export const phoneDrawing = { width: 300, height: 480 };
/** The smallest a dimension label may be on that phone, px. */
export const minLabelPx = 11;

export interface PieceDrawingLayout {
	size: number;
	view: Box;
	outlineBox: Box;
	name: { svg: string; rect: Rect };
	fold: Rect | null;
	labels: DimensionLabel[];
}

/** Screen pixels per drawing unit when `view` is fitted into the phone's drawing box. */
export const phoneScale = (view: Box) => Math.min(phoneDrawing.width / view.width, phoneDrawing.height / view.height);

/** What a piece's drawing layout needs that does not depend on the text size. */
interface PieceFacts {
	piece: DraftPiece;
	outlineBox: Box;
	dimensions: { from: Point; to: Point; text: string }[];
	/** The bounds of the outline, the dimension lines and the marks. */
	drawn: { minX: number; minY: number; maxX: number; maxY: number };
}

function pieceFacts(piece: DraftPiece, unit: Unit): PieceFacts {
	const dimensions: PieceFacts['dimensions'] = [];
	for (const l of piece.lines)
		if (l.dimension) dimensions.push({ ...l.dimension, text: formatLength(l.mm, unit, { withUnit: true }) });
	const drawn = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
	const extend = ({ x, y }: Point) => {
		drawn.minX = Math.min(drawn.minX, x);
		drawn.minY = Math.min(drawn.minY, y);
		drawn.maxX = Math.max(drawn.maxX, x);
		drawn.maxY = Math.max(drawn.maxY, y);
	};
	piece.outline.forEach(extend);
	for (const d of dimensions) {
		extend(d.from);
		extend(d.to);
	}
	for (const m of piece.marks) m.points.forEach(extend);
	return { piece, outlineBox: boundingBox(piece.outline), dimensions, drawn };
}

function layoutAt({ piece, outlineBox, dimensions, drawn }: PieceFacts, size: number): PieceDrawingLayout {
	const name = pieceLabel(piece, outlineBox, size);
	const fold = piece.cut.onFold ? foldRect(outlineBox, size) : null;
	const labels = placeDimensionLabels(dimensions, size * 0.85, outlineBox, fold ? [name.rect, fold] : [name.rect]);
	let { minX, minY, maxX, maxY } = drawn;
	for (const r of [...labels.map((l) => l.rect), name.rect]) {
		minX = Math.min(minX, r.x0, r.x1);
		minY = Math.min(minY, r.y0, r.y1);
		maxX = Math.max(maxX, r.x0, r.x1);
		maxY = Math.max(maxY, r.y0, r.y1);
	}
	const margin = size * 1.2;
	const view = {
		x: minX - margin,
		y: minY - margin,
		width: maxX - minX + 2 * margin,
		height: maxY - minY + 2 * margin
	};
	return { size, view, outlineBox, name, fold, labels };
}

/**
 * Where everything goes in a piece drawing. Text scales with the piece, grown where needed so dimension
 * labels are at least `minLabelPx` on a 360 px phone; labels are kept clear of each other and of the fold
 * bracket and piece name.
 */
export function pieceLayout(piece: DraftPiece, unit: Unit): PieceDrawingLayout {
	const facts = pieceFacts(piece, unit);
	const all = [
		...piece.outline,
		...piece.lines.flatMap((l) => (l.dimension ? [l.dimension.from, l.dimension.to] : []))
	];
	const box = boundingBox(all);
	let layout = layoutAt(facts, Math.max(Math.max(box.width, box.height) / 36, 6));
	for (let i = 0; i < 8 && layout.labels.length; i++) {
		const px = layout.labels[0].fontSize * phoneScale(layout.view);
		// 1 % in hand: the drawing writes sizes and its view box to a tenth of a unit.
		if (px >= minLabelPx * 1.01) break;
		layout = layoutAt(facts, layout.size * (minLabelPx / px) * 1.02);
	}
	return layout;
}

/** One pattern piece: outline, construction marks, grainline, fold marker and dimensions in `unit`. */
export function pieceSvg(piece: DraftPiece, unit: Unit): string {
	const { size, view, outlineBox, name, labels } = pieceLayout(piece, unit);
	const title = `${piece.label}: ${cutText(piece.cut)}, ${piece.cut.grain} grain`;
	return [
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(view.x)} ${n(view.y)} ${n(view.width)} ${n(view.height)}" role="img" font-family="Poppins, ui-sans-serif, sans-serif" data-piece="${escapeXml(piece.id)}">`,
		`<title>${escapeXml(title)}</title>`,
		`<${piece.path ? `path d="${pathData(piece.path)}"` : `polygon points="${points(piece.outline)}"`} fill="#f7f2e9" stroke="${ink}" stroke-width="2" vector-effect="non-scaling-stroke" stroke-linejoin="round"/>`,
		...piece.marks.map((m) => mark(m, size)),
		grainline(piece.grainline, size),
		piece.cut.onFold ? foldMarker(outlineBox, size) : '',
		name.svg,
		...labels.map(dimension),
		'</svg>'
	].join('');
}

function placementLabel(p: FabricEstimate['placements'][number], size: number): string {
	const label = p.yields > 1 ? `${p.label} ×${p.yields}` : p.label;
	const upright = p.h > 2.5 * p.w && p.w < size * label.length * 0.6;
	const fit = Math.min(size, (upright ? p.h : p.w) / (label.length * 0.65));
	return text({ x: p.w / 2, y: p.h / 2 }, label, fit, { weight: 600, rotate: upright ? -90 : 0 });
}

/** A nested piece: its real cutting line, grain arrow and name where it lies on the cloth. */
function nestedPlacement(p: FabricEstimate['placements'][number], size: number): string {
	const label = p.yields > 1 ? `${p.label} ×${p.yields}` : p.label;
	const [a, b] = p.grainline!;
	const upright = p.h > 1.6 * p.w;
	const fit = Math.min(size, (upright ? p.h : p.w) / (label.length * 0.65));
	const centre = { x: p.x + p.w / 2, y: p.y + p.h / 2 };
	const at = upright ? { x: centre.x + fit * 1.2, y: centre.y } : { x: centre.x, y: centre.y - fit * 1.2 };
	return [
		`<polygon points="${points(p.outline!)}" fill="#fae2da" stroke="${madder}" stroke-width="1.5" vector-effect="non-scaling-stroke" stroke-linejoin="round"/>`,
		`<line x1="${n(a.x)}" y1="${n(a.y)}" x2="${n(b.x)}" y2="${n(b.y)}" ${stroke(ink, 1.2)}/>`,
		arrowHead(b, a, size * 0.5, ink),
		arrowHead(a, b, size * 0.5, ink),
		text(at, label, fit, { weight: 600, rotate: upright ? -90 : 0 })
	].join('');
}

/** The cloth with every piece placed, fold on the left when folded, length marks every yard or metre. */
export function layoutSvg(estimate: FabricEstimate, unit: Unit, cloth: 'cloth' | 'lining' = 'cloth'): string {
	const width = estimate.layWidthMm;
	const length = estimate.packedMm;
	const size = Math.max(width, length) / 40;
	const margin = size * 3;
	const step = unit === 'in' ? mmPerYard : mmPerMetre;
	const stepLabel = unit === 'in' ? 'yd' : 'm';
	const ticks: string[] = [];
	for (let i = 1; i * step <= length + 1e-6; i++) {
		ticks.push(
			`<line x1="0" y1="${n(i * step)}" x2="${n(width)}" y2="${n(i * step)}" ${stroke('#c4b293', 1, '3 4')}/>`
		);
		ticks.push(
			text({ x: width - size * 0.3, y: i * step - size * 0.6 }, `${i} ${stepLabel}`, size * 0.8, {
				anchor: 'end',
				colour: '#5d6170'
			})
		);
	}
	const placed = estimate.placements.map((p) => {
		if (p.outline) return nestedPlacement(p, size);
		return [
			`<g transform="translate(${n(p.x)} ${n(p.y)})">`,
			`<rect width="${n(p.w)}" height="${n(p.h)}" ${stroke('#7b7f8c', 1, '4 3')}/>`,
			...p.shapes.map(
				(o) =>
					`<polygon points="${points(o)}" fill="#fae2da" stroke="${madder}" stroke-width="1.5" vector-effect="non-scaling-stroke"/>`
			),
			placementLabel(p, size),
			'</g>'
		].join('');
	});
	const foldSide = estimate.folded
		? [
				`<line x1="0" y1="0" x2="0" y2="${n(length)}" ${stroke(madder, 2.5, '10 4')}/>`,
				text({ x: -size * 0.9, y: length / 2 }, 'fold', size, { rotate: -90, colour: madder, weight: 600 }),
				text({ x: width + size * 0.9, y: length / 2 }, 'selvedges', size * 0.8, { rotate: 90, colour: '#5d6170' })
			]
		: [text({ x: -size * 0.9, y: length / 2 }, 'selvedge', size * 0.8, { rotate: -90, colour: '#5d6170' })];
	const title = `${cloth === 'lining' ? 'Lining layout' : 'Layout'} on ${formatLength(estimate.widthMm, unit, { withUnit: true })} ${cloth}${estimate.folded ? ', folded' : ''}: ${estimate.rounded.display}`;
	return [
		`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${n(-margin)} ${n(-size)} ${n(width + 2 * margin + size * 2)} ${n(length + size * 3)}" role="img" font-family="Poppins, ui-sans-serif, sans-serif">`,
		`<title>${escapeXml(title)}</title>`,
		`<rect x="0" y="0" width="${n(width)}" height="${n(length)}" fill="#fcfaf6" stroke="${ink}" stroke-width="1.5" vector-effect="non-scaling-stroke"/>`,
		...ticks,
		...placed,
		...foldSide,
		text(
			{ x: width / 2, y: length + size * 1.2 },
			`${formatLength(length, unit, { withUnit: true })} laid out · buy ${estimate.rounded.display}`,
			size * 0.9
		),
		'</svg>'
	].join('');
}
