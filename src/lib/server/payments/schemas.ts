import { z } from 'zod';

/** `POST /api/v1/orders/{id}/checkout` takes no fields; a body, if sent, must be an empty object. */
export const checkoutRequest = z
	.object({})
	.strict()
	.meta({ description: 'Nothing to send; the body may be left out.' });
