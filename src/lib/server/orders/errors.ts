export type OrderErrorCode = 'not_found' | 'forbidden' | 'conflict' | 'invalid';

export type OrderIssue = { path: string; message: string };

/**
 * A refused order action. `not_found` is also the answer for people who are not a party to the order, so they
 * learn nothing about it; `conflict` names the order's current state.
 */
export class OrderError extends Error {
	constructor(
		readonly code: OrderErrorCode,
		message: string,
		readonly issues: OrderIssue[] = []
	) {
		super(message);
	}
}

export const orderErrorStatus: Record<OrderErrorCode, 400 | 403 | 404 | 409> = {
	invalid: 400,
	forbidden: 403,
	not_found: 404,
	conflict: 409
};
