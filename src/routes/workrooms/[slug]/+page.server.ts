import { error, redirect } from '@sveltejs/kit';
import * as workrooms from '$lib/server/workrooms';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async ({ locals, params }) => {
	const workroom = await workrooms.getPublic(locals.db, { slugOrId: params.slug });
	if (!workroom) error(404, { message: 'There is no workroom at this address.', code: 'not_found' });
	// A tailor's id works too, but the page lives at its name.
	if (workroom.slug !== params.slug) redirect(301, `/workrooms/${workroom.slug}`);
	return { workroom, viewerRole: locals.user?.role ?? null };
};
