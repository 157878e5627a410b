export type FittingIssue = { path: string; message: string };

export type FittingErrorCode = 'forbidden' | 'not_found' | 'wrong_status' | 'too_late' | 'conflict' | 'invalid';

/** A refused fitting change; routes turn the code into a status (403, 404, 409, 409, 409, 400). */
export class FittingError extends Error {
	constructor(
		readonly code: FittingErrorCode,
		message: string,
		readonly issues: FittingIssue[] = []
	) {
		super(message);
	}
}

export const errorStatus: Record<FittingErrorCode, 400 | 403 | 404 | 409> = {
	forbidden: 403,
	not_found: 404,
	wrong_status: 409,
	too_late: 409,
	conflict: 409,
	invalid: 400
};
