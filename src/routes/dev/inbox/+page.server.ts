import * as inbox from '$lib/server/dev/inbox';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async () => ({
	messages: (await inbox.list()).map(({ id, to, subject, receivedAt }) => ({ id, to, subject, receivedAt }))
});
