import * as inbox from '$lib/server/dev/inbox';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ params }) => ({ message: await inbox.get({ id: params.id }) });
