import { z } from 'zod';
import { garmentIds, measurementCodes } from './measurements';
import { optionInUnit } from './options';
import { papers } from './print/paper';
import { isCurrencyCode } from './quote';
import { templates } from './templates/index';
import { formatLength, toMm, units } from './units';

/* Request schemas for the drafting API. Lengths are in the request's unit. */

const unit = z.enum(units);
const positiveLength = z.number().finite().positive().max(100_000);

/*
 * Caps sized to what garments need, so one request cannot keep the server busy. A garment has a few
 * to a few dozen pieces; a whole outfit fits in 100 (common practice, from memory). The widest cloth
 * commonly sold is sheeting about 3 m wide; no pattern piece is longer than 3 m.
 */
export const layoutCaps = { entries: 50, totalPieces: 100, clothWidthMm: 3300, pieceMm: 3000, repeatMm: 1000 };

function capLength(
	ctx: z.RefinementCtx,
	value: number,
	unit: (typeof units)[number],
	maxMm: number,
	path: PropertyKey[]
) {
	if (toMm(value, unit) > maxMm + 1e-6)
		ctx.addIssue({
			code: 'custom',
			path,
			message: `At most ${formatLength(maxMm, unit, { withUnit: true })}.`
		});
}

export const measurementsSchema = z.partialRecord(z.enum(measurementCodes), positiveLength);

const fabricSchema = z
	.object({
		width: positiveLength,
		folded: z.boolean().default(true),
		directional: z.boolean().default(false),
		shrinkage: z.number().min(0).max(20).default(0),
		repeat: z.number().min(0).max(10_000).default(0)
	})
	.strict();

export const draftRequestSchema = z
	.object({
		garment: z.enum(garmentIds),
		unit,
		measurements: measurementsSchema,
		options: z.record(z.string(), z.union([z.number().finite(), z.string(), z.boolean()])).default({}),
		fabric: fabricSchema.optional(),
		/** True once the person has confirmed the numbers are in `unit` (answers a suspected unit mix-up). */
		unitConfirmed: z.boolean().default(false),
		/**
		 * Nest the pieces' real outlines on the cloth (up to about two seconds of work); otherwise their boxes
		 * are packed, which takes milliseconds. `fabric.nested` in the answer says which was done.
		 */
		nest: z.boolean().default(false)
	})
	.strict()
	.superRefine((request, ctx) => {
		if (request.fabric) {
			capLength(ctx, request.fabric.width, request.unit, layoutCaps.clothWidthMm, ['fabric', 'width']);
			capLength(ctx, request.fabric.repeat, request.unit, layoutCaps.repeatMm, ['fabric', 'repeat']);
		}
		const template = templates[request.garment];
		for (const [id, value] of Object.entries(request.options)) {
			const found = template.options.find((o) => o.id === id);
			const spec = found && optionInUnit(found, request.unit);
			const path = ['options', id];
			if (!spec) {
				ctx.addIssue({
					code: 'custom',
					path,
					message: `Not an option of ${request.garment}; expected one of ${template.options.map((o) => o.id).join(', ')}.`
				});
			} else if (spec.kind === 'length') {
				const ok =
					typeof value === 'number' &&
					toMm(value, request.unit) >= spec.minMm - 1e-6 &&
					toMm(value, request.unit) <= spec.maxMm + 1e-6;
				if (!ok) {
					const range = `${formatLength(spec.minMm, request.unit)}–${formatLength(spec.maxMm, request.unit, { withUnit: true })}`;
					ctx.addIssue({ code: 'custom', path, message: `${spec.label} must be a number between ${range}.` });
				}
			} else if (spec.kind === 'choice' && !spec.choices.some((c) => c.value === value)) {
				ctx.addIssue({
					code: 'custom',
					path,
					message: `Must be one of ${spec.choices.map((c) => c.value).join(', ')}.`
				});
			} else if (spec.kind === 'boolean' && typeof value !== 'boolean') {
				ctx.addIssue({ code: 'custom', path, message: 'Must be true or false.' });
			}
		}
	});

export type DraftRequest = z.input<typeof draftRequestSchema>;

export const layoutRequestSchema = z
	.object({
		width: positiveLength,
		unit,
		pieces: z
			.array(
				z
					.object({
						w: positiveLength,
						h: positiveLength,
						quantity: z.number().int().min(1).max(layoutCaps.totalPieces).default(1),
						rotate: z.enum(['none', '180', 'any']).default('none')
					})
					.strict()
			)
			.min(1)
			.max(layoutCaps.entries)
	})
	.strict()
	.superRefine((request, ctx) => {
		const total = request.pieces.reduce((sum, p) => sum + p.quantity, 0);
		if (total > layoutCaps.totalPieces)
			ctx.addIssue({
				code: 'custom',
				path: ['pieces'],
				message: `At most ${layoutCaps.totalPieces} pieces in all (quantities included).`
			});
		capLength(ctx, request.width, request.unit, layoutCaps.clothWidthMm, ['width']);
		request.pieces.forEach((piece, i) => {
			capLength(ctx, piece.w, request.unit, layoutCaps.pieceMm, ['pieces', i, 'w']);
			capLength(ctx, piece.h, request.unit, layoutCaps.pieceMm, ['pieces', i, 'h']);
			const fits = piece.w <= request.width || (piece.rotate === 'any' && piece.h <= request.width);
			if (!fits)
				ctx.addIssue({
					code: 'custom',
					path: ['pieces', i, 'w'],
					message: `Wider than the fabric (${request.width} ${request.unit}).`
				});
		});
	});

export type LayoutRequest = z.input<typeof layoutRequestSchema>;

const minor = z.number().int().min(0).max(1_000_000_000);
const pricedItem = z.object({ label: z.string().trim().min(1).max(80), amountMinor: minor }).strict();

export const quoteRequestSchema = z
	.object({
		currency: z.string().refine(isCurrencyCode, 'An ISO 4217 currency code such as USD, EUR or KES.'),
		garment: z.enum(garmentIds).optional(),
		fabric: z.discriminatedUnion('supply', [
			z.object({ supply: z.literal('customer') }).strict(),
			z
				.object({
					supply: z.literal('tailor'),
					pricePerUnitMinor: minor,
					per: z.enum(['yd', 'm']),
					length: z.number().positive().max(100),
					lengthUnit: z.enum(['yd', 'm']).optional()
				})
				.strict()
		]),
		lining: z
			.object({
				pricePerUnitMinor: minor,
				per: z.enum(['yd', 'm']),
				length: z.number().positive().max(100),
				lengthUnit: z.enum(['yd', 'm']).optional()
			})
			.strict()
			.optional()
			.meta({ description: 'Lining cloth for a lined garment: the lining layout’s length and its price.' }),
		labourHours: z.number().min(0).max(1000).optional(),
		hourlyRateMinor: minor,
		notions: z.array(pricedItem).max(50).default([]),
		extras: z.array(pricedItem).max(50).default([])
	})
	.strict()
	.refine((q) => q.labourHours !== undefined || q.garment !== undefined, {
		path: ['labourHours'],
		message: 'Give labour hours, or a garment to use its default.'
	});

export type QuoteRequest = z.input<typeof quoteRequestSchema>;

/** `GET /api/v1/garments?unit=cm|in`: lengths in the answer are in this unit. */
export const garmentsQuerySchema = z.object({ unit: unit.default('cm') });

/** `GET /api/v1/drafts/pattern.pdf?paper=a4&request={…}`. */
export const patternPdfQuerySchema = z.object({
	paper: z.enum(papers).default('a4').meta({ description: 'A4 or US Letter tiles, or one A0 or 36 in roll sheet.' }),
	request: z
		.string()
		.min(2)
		.max(8192)
		.meta({ description: 'The same JSON as the body of POST /api/v1/drafts, URL-encoded.' })
});
