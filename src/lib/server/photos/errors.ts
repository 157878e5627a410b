export type PhotoRuleCode = 'not_found' | 'photo_limit' | 'not_editable' | 'invalid_order' | 'no_workroom';

const statuses: Record<PhotoRuleCode, 400 | 404 | 409> = {
	not_found: 404,
	photo_limit: 409,
	not_editable: 409,
	invalid_order: 400,
	no_workroom: 409
};

/**
 * A photo action the rules do not allow (as opposed to `PhotoRefused`, an upload that is not a usable
 * image). `not_found` also covers what the actor may not know exists.
 */
export class PhotoRuleBroken extends Error {
	readonly status: 400 | 404 | 409;
	constructor(
		readonly code: PhotoRuleCode,
		message: string
	) {
		super(message);
		this.name = 'PhotoRuleBroken';
		this.status = statuses[code];
	}
}

export const notFound = () => new PhotoRuleBroken('not_found', 'There is no such photo or commission.');
