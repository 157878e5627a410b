import { z } from 'zod';
import { progressStepKinds } from '$lib/types/order-page';
import { maxAltTextLength } from '$lib/types/photos';
import { text } from '../forms';

/* The order page's forms. The same rules as the JSON API's bodies, spelled for form fields. */

export const progressForm = z.object({
	step: z.enum(progressStepKinds, { error: 'Choose the step you have reached.' }),
	note: text({ max: 2000, multiline: true }).optional().default(''),
	photoAlt: text({ max: maxAltTextLength }).optional().default('')
});

export const deliverForm = z
	.object({
		method: z.enum(['pickup', 'courier'], { error: 'Choose pickup or courier.' }),
		trackingReference: text({ max: 100 }).optional().default(''),
		note: text({ max: 1000, multiline: true }).optional().default('')
	})
	.superRefine((value, context) => {
		if (value.method === 'courier' && !value.trackingReference)
			context.addIssue({
				code: 'custom',
				path: ['trackingReference'],
				message: 'Enter the courier’s tracking reference.'
			});
	});

export const alterationForm = z.object({
	note: text({ max: 2000, min: 1, multiline: true, tooShort: 'Say what needs altering.' })
});

export const cancelForm = z.object({ reason: text({ max: 500 }).optional().default('') });

/** The fields each form keeps after a refusal, so the page refills what was typed. */
export const keptFields = {
	progress: ['step', 'note', 'photoAlt'],
	deliver: ['method', 'trackingReference', 'note'],
	alteration: ['note'],
	cancel: ['reason']
} as const;
