import { requireRole } from '$lib/server/auth/guard';
import * as inbox from '$lib/server/dev/inbox';
import type { PageServerLoad } from './$types';

// Everyone's sign-in links land here: administrators only, and only in builds with development tools.
export const load: PageServerLoad = async () => {
	inbox.requireDevTools();
	requireRole('admin');
	return { messages: (await inbox.list()).map(({ id, to, subject, receivedAt }) => ({ id, to, subject, receivedAt })) };
};
