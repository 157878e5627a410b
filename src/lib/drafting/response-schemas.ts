import { z } from 'zod';
import { garmentIds, measurementCodes } from './measurements';
import { units } from './units';

/*
 * The JSON answers of the drafting API, for the API document. Each mirrors a type the code builds
 * (`DraftResponse`, `LayoutResponse`, `QuoteEstimate`, `listGarments`); the OpenAPI module checks at
 * compile time that every built answer fits its schema.
 */

const unit = z.enum(units);

export const findingCodes = [
	'not_positive',
	'out_of_range',
	'likely_typo',
	'unit_mixup',
	'unusual_relation',
	'impossible_relation',
	'missing_measurements',
	'option_out_of_range',
	'fabric_too_narrow'
] as const;

export const findingSchema = z
	.object({
		code: z.enum(findingCodes),
		fields: z.array(z.string()).meta({ description: 'Measurement codes or option ids the finding is about.' }),
		message: z.string(),
		suggestedUnit: unit.optional().meta({ description: 'For a unit mix-up: the unit the numbers look like.' })
	})
	.meta({ id: 'Finding', description: 'A warning (never blocks) or an error (blocks drafting).' });

export const checkResultSchema = z
	.object({ warnings: z.array(findingSchema), errors: z.array(findingSchema) })
	.meta({ id: 'CheckResult' });

const line = z
	.object({ id: z.string(), label: z.string(), value: z.number(), display: z.string() })
	.meta({ id: 'DraftLine', description: 'A length in the request’s unit, with its display text.' });

export const sizeBandSchema = z
	.object({
		dimensions: z.array(
			z.object({
				code: z.enum(measurementCodes),
				label: z.string(),
				minCm: z.number(),
				maxCm: z.number(),
				designationCm: z.number()
			})
		),
		text: z.string()
	})
	.meta({ id: 'SizeBand', description: 'EN 13402-3 designations of the primary girths.' });

export const draftResponseSchema = z
	.object({
		garment: z.enum(garmentIds),
		name: z.string(),
		unit,
		method: z.string().meta({ description: 'Where the drafting rules come from.' }),
		pieces: z.array(
			z.object({
				id: z.string(),
				label: z.string(),
				cut: z.object({
					quantity: z.int(),
					onFold: z.boolean(),
					pair: z.boolean(),
					grain: z.enum(['lengthwise', 'crosswise']),
					cloth: z
						.enum(['lining'])
						.optional()
						.meta({ description: 'Cut from the lining, laid and estimated apart from the garment cloth.' }),
					text: z.string()
				}),
				lines: z.array(line),
				svg: z.string().meta({ description: 'The piece drawn with its dimensions, as SVG markup.' }),
				bbox: z.object({ width: z.number(), height: z.number() }),
				outlineMm: z.array(z.tuple([z.number(), z.number()])).meta({ description: 'Closed outline, mm.' })
			})
		),
		fabric: z
			.object({
				width: z.number(),
				folded: z.boolean(),
				directional: z.boolean(),
				length: z.number(),
				lengthRounded: z.number(),
				buyUnit: z.enum(['yd', 'm']),
				lengthDisplay: z.string(),
				efficiency: z.number(),
				svg: z.string(),
				packedLength: z.number(),
				shrinkagePercent: z.number(),
				roundingAdded: z.number(),
				notes: z.array(z.string()),
				nested: z.boolean(),
				lining: z
					.object({
						pieces: z.string().meta({ description: 'The pieces cut in lining, in words.' }),
						fits: z.boolean().meta({ description: 'False when a lining piece is wider than the lining.' }),
						width: z.number(),
						folded: z.boolean(),
						length: z.number(),
						lengthRounded: z.number(),
						buyUnit: z.enum(['yd', 'm']),
						lengthDisplay: z.string(),
						efficiency: z.number(),
						svg: z.string(),
						nested: z.boolean()
					})
					.nullable()
					.meta({
						description: 'A lined garment’s lining, laid apart on lining as wide as the cloth; null when unlined.'
					})
			})
			.nullable(),
		sizeBand: sizeBandSchema.nullable(),
		allowances: z.array(line),
		notes: z.array(z.string()),
		cautions: z.array(z.object({ code: z.string(), message: z.string() })),
		warnings: z.array(findingSchema),
		errors: z.array(findingSchema)
	})
	.meta({ id: 'Draft' });

export const layoutResponseSchema = z
	.object({
		unit,
		width: z.number(),
		length: z.number(),
		efficiency: z.number(),
		lowerBound: z.number(),
		algorithm: z.string(),
		placements: z.array(
			z.object({
				piece: z.int(),
				copy: z.int(),
				x: z.number(),
				y: z.number(),
				w: z.number(),
				h: z.number(),
				rotated: z.boolean()
			})
		)
	})
	.meta({ id: 'Layout' });

export const quoteEstimateResponseSchema = z
	.object({
		currency: z.string().length(3),
		exponent: z.int().meta({ description: 'The currency’s ISO 4217 minor-unit exponent.' }),
		lines: z.array(z.object({ id: z.string(), label: z.string(), amountMinor: z.int() })),
		totalMinor: z.int(),
		range: z.object({ lowMinor: z.int(), highMinor: z.int() }),
		labourHours: z.number()
	})
	.meta({ id: 'QuoteEstimate' });

const optionBase = { id: z.string(), label: z.string(), help: z.string().optional() };

export const garmentListSchema = z.array(
	z
		.object({
			id: z.enum(garmentIds),
			name: z.string(),
			summary: z.string(),
			requiredMeasurements: z.array(z.enum(measurementCodes)),
			optionalMeasurements: z.array(z.enum(measurementCodes)),
			options: z.array(
				z.discriminatedUnion('kind', [
					z.object({
						...optionBase,
						kind: z.literal('length'),
						unit,
						default: z.number().nullable(),
						defaultFrom: z.string().optional(),
						min: z.number(),
						max: z.number()
					}),
					z.object({
						...optionBase,
						kind: z.literal('choice'),
						default: z.string(),
						choices: z.array(z.object({ value: z.string(), label: z.string() }))
					}),
					z.object({ ...optionBase, kind: z.literal('boolean'), default: z.boolean() })
				])
			),
			defaultLabourHours: z.number()
		})
		.meta({ id: 'Garment' })
);
