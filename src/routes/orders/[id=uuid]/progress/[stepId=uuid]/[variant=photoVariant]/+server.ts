import { error } from '@sveltejs/kit';
import { requireUser } from '$lib/server/auth/guard';
import { openProgressPhoto } from '$lib/server/orders/page';
import { photoResponse } from '$lib/server/photos';
import type { RequestHandler } from './$types';

const notFound = { message: 'There is no such photo.', code: 'not_found' };

/** A progress photo, for the order's customer, its tailor and admins only; anyone else gets the same 404. */
export const GET: RequestHandler = async ({ params, locals, request }) => {
	const viewer = requireUser();
	const photo = await openProgressPhoto(locals.db, {
		orderId: params.id,
		stepId: params.stepId,
		variant: params.variant,
		viewer
	});
	if (!photo) error(404, notFound);
	return photoResponse(photo, request);
};
