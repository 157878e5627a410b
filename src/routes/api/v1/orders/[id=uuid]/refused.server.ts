import * as payments from '$lib/server/payments';
import { apiError } from '$lib/server/http/respond';

/** A refused payment action as the API's error body; anything else is a real failure and is rethrown. */
export function refusedPayment(error: unknown) {
	if (!(error instanceof payments.PaymentError)) throw error;
	return apiError(payments.errorStatus[error.code], error.code, error.message);
}
