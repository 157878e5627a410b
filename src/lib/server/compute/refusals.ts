// Relative imports only: this module also runs inside worker threads, outside Vite.
import { implausibleCodes, type DraftResponse } from '../../drafting/draft';

/** The API's error body, as `apiError` in `http/respond` writes it, for answers shaped off the request thread. */
export type ErrorBody = { error: { code: string; message: string; issues: { path: string; message: string }[] } };

/** A draft from values no body has, or from an unconfirmed unit mix-up, is refused (422) rather than drawn. */
export function implausibleRefusal(draft: DraftResponse): ErrorBody | null {
	const implausible = draft.errors.filter((e) => implausibleCodes.has(e.code));
	if (!implausible.length) return null;
	return {
		error: {
			code: 'implausible_measurements',
			message: implausible.some((e) => e.code === 'unit_mixup')
				? 'Some measurements look like another unit. Correct them, change the unit, or send unitConfirmed: true if they are right.'
				: 'Some measurements cannot be right. Please correct them.',
			issues: implausible.flatMap((e) =>
				e.fields.map((field) => ({ path: `measurements.${field}`, message: e.message }))
			)
		}
	};
}
