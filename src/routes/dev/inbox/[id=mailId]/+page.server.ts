import { requireRole } from '$lib/server/auth/guard';
import * as inbox from '$lib/server/dev/inbox';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => {
	inbox.requireDevTools();
	requireRole('admin');
	return { message: await inbox.get({ id: params.id }) };
};
