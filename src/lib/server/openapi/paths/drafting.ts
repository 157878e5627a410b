import { z } from 'zod';
import {
	draftRequestSchema,
	garmentsQuerySchema,
	layoutRequestSchema,
	patternPdfQuerySchema,
	quoteRequestSchema
} from '$lib/drafting';
import {
	draftResponseSchema,
	garmentListSchema,
	layoutResponseSchema,
	quoteEstimateResponseSchema
} from '$lib/drafting/response-schemas';
import { access, errors, jsonBody, jsonRequest, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Drafting'];
const busy = 'Each computation has a time budget: 422 `too_complex` past it, 503 `busy` when the queue is full.';

const paths: Paths = {
	'/api/v1/garments': {
		get: {
			operationId: 'listGarments',
			tags,
			summary: 'List the garments Tackline can draft',
			...access(
				'public',
				'Each garment with the measurements it needs and its options, lengths in the unit asked for. Sent with an ETag; `If-None-Match` answers 304.'
			),
			requestParams: { query: garmentsQuerySchema },
			responses: {
				'200': jsonBody(garmentListSchema, 'The garment catalogue.'),
				'304': { description: 'Not modified since the ETag sent in `If-None-Match`.' },
				...errors(400)
			}
		}
	},
	'/api/v1/drafts': {
		post: {
			operationId: 'draftGarment',
			tags,
			summary: 'Draft a garment from measurements',
			...access(
				'public',
				`The cutting draft: pieces with their dimensions and SVG drawings, allowances, a fabric estimate (the pieces' boxes packed on the cloth, or with \`nest: true\` their real outlines nested, which takes up to a couple of seconds) and the size band. Findings that stop a draft come back in \`errors\` (a 200); values no body has, or an unconfirmed unit mix-up, answer 422 \`implausible_measurements\`. ${busy}`
			),
			requestBody: jsonRequest(draftRequestSchema),
			responses: {
				'200': jsonBody(draftResponseSchema, 'The draft, or why it cannot be drawn yet.'),
				...errors(400, 413, 415, 422, 503)
			}
		}
	},
	'/api/v1/drafts/pattern.pdf': {
		get: {
			operationId: 'printPattern',
			tags,
			summary: 'Print a draft’s pieces at full size',
			...access(
				'public',
				`A PDF of the pieces at full size: tiled on A4 or US Letter with overlaps, or one large sheet (A0, 36 in roll). 422 \`draft_incomplete\` when the draft cannot be drawn. ${busy}`
			),
			requestParams: { query: patternPdfQuerySchema },
			responses: {
				'200': {
					description: 'The pattern.',
					content: {
						'application/pdf': {
							schema: z.string().meta({ override: { type: 'string', contentMediaType: 'application/pdf' } })
						}
					}
				},
				...errors(400, 422, 503)
			}
		}
	},
	'/api/v1/layouts': {
		post: {
			operationId: 'layoutPieces',
			tags,
			summary: 'Lay rectangles on a strip of cloth',
			...access('public', `Any rectangles on a given width, shortest length wins. ${busy}`),
			requestBody: jsonRequest(layoutRequestSchema),
			responses: {
				'200': jsonBody(layoutResponseSchema, 'Where each piece goes and the length used.'),
				...errors(400, 413, 415, 422, 503)
			}
		}
	},
	'/api/v1/quotes/estimate': {
		post: {
			operationId: 'estimateQuote',
			tags,
			summary: 'Work out a suggested price',
			...access(
				'public',
				`Fabric × price per length, labour hours × rate, notions and extras, with a range the tailor can edit. Amounts in minor units. ${busy}`
			),
			requestBody: jsonRequest(quoteRequestSchema),
			responses: {
				'200': jsonBody(quoteEstimateResponseSchema, 'The working and the total.'),
				...errors(400, 413, 415, 422, 503)
			}
		}
	}
};

export const draftingArea: Area = {
	tag: {
		name: 'Drafting',
		description: 'The trade computation: garments, cutting drafts, fabric layouts, price estimates. No session needed.'
	},
	paths
};
