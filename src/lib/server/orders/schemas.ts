import { z } from 'zod';
import { progressStepKind } from '../db/schema';
import { text } from '../forms';

export const noteMax = 1000;
export const reasonMax = 500;
export const trackingMax = 100;

/** `POST /api/v1/orders/{id}/progress`, and the order page's progress form. */
export const progressRequest = z
	.object({
		step: z.enum(progressStepKind.enumValues).meta({ description: 'Which step of the work this is.' }),
		note: text({ max: noteMax, multiline: true }).default('').meta({ description: 'A few words for the customer.' })
	})
	.strict()
	.meta({ id: 'ProgressRequest' });

/** `POST /api/v1/orders/{id}/deliver`: pickup at the workroom, or courier with its tracking reference. */
export const deliverRequest = z
	.object({
		method: z.enum(['pickup', 'courier']),
		trackingReference: text({ max: trackingMax })
			.optional()
			.meta({ description: 'The courier’s tracking reference; required for `courier`.' }),
		note: text({ max: noteMax, multiline: true }).default('')
	})
	.strict()
	.superRefine((value, ctx) => {
		if (value.method === 'courier' && !value.trackingReference)
			ctx.addIssue({
				code: 'custom',
				path: ['trackingReference'],
				message: 'Enter the courier’s tracking reference.'
			});
	})
	.meta({ id: 'DeliverRequest' });

/** `POST /api/v1/orders/{id}/alteration`: what needs changing. */
export const alterationRequest = z
	.object({
		note: text({ min: 1, max: noteMax, multiline: true, tooShort: 'Say what needs changing.' })
	})
	.strict()
	.meta({ id: 'AlterationRequest' });

/** `POST /api/v1/orders/{id}/cancel`: an optional reason; `decline: true` answers the other side's request with no. */
export const cancelRequest = z
	.object({
		reason: text({ max: reasonMax, multiline: true }).default(''),
		decline: z
			.boolean()
			.default(false)
			.meta({ description: 'Turn down (or, as the asking side, withdraw) an open request to cancel.' })
	})
	.strict()
	.meta({ id: 'CancelRequest' });

/** `POST /api/v1/orders/{id}/confirm` and `…/fabric-approval` take no fields; a body, if sent, must be `{}`. */
export const emptyRequest = z.object({}).strict().meta({ description: 'Nothing to send; the body may be left out.' });
