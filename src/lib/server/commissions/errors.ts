export type CommissionIssue = { path: string; message: string };

export type CommissionErrorCode = 'forbidden' | 'not_found' | 'wrong_status' | 'incomplete' | 'invalid';

/** A refused commission change; routes turn the code into a status (403, 404, 409, 422, 400). */
export class CommissionError extends Error {
	constructor(
		readonly code: CommissionErrorCode,
		message: string,
		readonly issues: CommissionIssue[] = []
	) {
		super(message);
	}
}

export const errorStatus: Record<CommissionErrorCode, 400 | 403 | 404 | 409 | 422> = {
	forbidden: 403,
	not_found: 404,
	wrong_status: 409,
	incomplete: 422,
	invalid: 400
};
