export type QuoteIssue = { path: string; message: string };

export type QuoteErrorCode = 'forbidden' | 'not_found' | 'wrong_status' | 'conflict' | 'invalid';

/** A refused quote or acceptance; routes turn the code into a status (403, 404, 409, 409, 400). */
export class QuoteError extends Error {
	constructor(
		readonly code: QuoteErrorCode,
		message: string,
		readonly issues: QuoteIssue[] = []
	) {
		super(message);
	}
}

export const errorStatus: Record<QuoteErrorCode, 400 | 403 | 404 | 409> = {
	forbidden: 403,
	not_found: 404,
	wrong_status: 409,
	conflict: 409,
	invalid: 400
};
