import { apiError } from '$lib/server/http/respond';
import type { DuplicateLabel } from '$lib/server/profiles';

export const duplicateLabel = (cause: DuplicateLabel) =>
	apiError(409, 'duplicate_label', cause.message, [{ path: 'label', message: cause.message }]);

export const profileNotFound = () =>
	apiError(404, 'not_found', 'There is no measurement profile with that id in your account.');
