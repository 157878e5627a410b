export type MessageErrorCode = 'not_found' | 'forbidden' | 'closed' | 'invalid' | 'not_onboarded';

/** A refused message action; routes turn the code into a status. `not_found` covers threads the actor is not in. */
export class MessageError extends Error {
	constructor(
		readonly code: MessageErrorCode,
		message: string,
		readonly issues: { path: string; message: string }[] = []
	) {
		super(message);
		this.name = 'MessageError';
	}
}

export const errorStatus: Record<MessageErrorCode, 400 | 403 | 404 | 409> = {
	not_found: 404,
	forbidden: 403,
	closed: 409,
	invalid: 400,
	not_onboarded: 403
};

export const noSuchThread = () => new MessageError('not_found', 'There is no such conversation.');
