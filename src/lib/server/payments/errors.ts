import { isProcessorOutage } from '../services/payments';

export type PaymentErrorCode = 'forbidden' | 'not_found' | 'conflict' | 'unavailable';

/** A refused payment action; routes turn the code into a status (403, 404, 409, 503). */
export class PaymentError extends Error {
	constructor(
		readonly code: PaymentErrorCode,
		message: string
	) {
		super(message);
	}
}

export const errorStatus: Record<PaymentErrorCode, 403 | 404 | 409 | 503> = {
	forbidden: 403,
	not_found: 404,
	conflict: 409,
	unavailable: 503
};

/** A processor outage becomes a 503 the person can retry; anything else is passed on unchanged. */
export function outageAsUnavailable(error: unknown): unknown {
	return isProcessorOutage(error)
		? new PaymentError(
				'unavailable',
				'The payment service is not answering just now. Nothing was charged; please try again in a minute.'
			)
		: error;
}
