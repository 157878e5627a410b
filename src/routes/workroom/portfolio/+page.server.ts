import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { garmentIds, garments } from '$lib/drafting';
import { requireRole } from '$lib/server/auth/guard';
import { text } from '$lib/server/forms';
import { portfolio } from '$lib/server/photos';
import * as workrooms from '$lib/server/workrooms';
import {
	addEach,
	altTextForm,
	moveForm,
	photoFormAction,
	photoIdForm,
	readUploadForm
} from '$lib/server/photos/form-actions';
import { photoLimits } from '$lib/types/photos';
import type { Actions, PageServerLoad } from './$types';

const itemId = z.object({ itemId: z.uuid() });
const itemFields = z.object({
	caption: text({ max: 200 }),
	garmentType: z.enum([...garmentIds, '']).transform((value) => value || null)
});
const offset = z.enum(['-1', '1']).transform(Number);

export const load: PageServerLoad = async ({ locals }) => {
	const actor = requireRole('tailor');
	const items = await portfolio.listItems(locals.db, { tailorId: actor.id });
	// Runs again after every action here: the first photo completes onboarding, removing the last undoes it.
	const onboarding = await workrooms.onboardingStatus(locals.db, { tailorId: actor.id });
	return {
		onboarding,
		items,
		photoCount: items.reduce((sum, item) => sum + item.photos.length, 0),
		limit: photoLimits.portfolio,
		garments: garments.map(({ id, name }) => ({ id, name }))
	};
};

export const actions: Actions = {
	createItem: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, itemFields, (data) => portfolio.createItem(locals.db, { actor, ...data }));
	},
	updateItem: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, itemId.extend(itemFields.shape), (data) =>
			portfolio.updateItem(locals.db, { actor, ...data })
		);
	},
	moveItem: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, itemId.extend({ offset }), (data) =>
			portfolio.moveItem(locals.db, { actor, ...data })
		);
	},
	removeItem: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, itemId, (data) => portfolio.removeItem(locals.db, { actor, ...data }));
	},
	upload: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		const form = await readUploadForm(request);
		if (!form.ok) return form.failure;
		const item = itemId.safeParse({ itemId: form.data.get('itemId') });
		if (!item.success) return fail(400, { formError: 'Choose the piece of work these photos show.' });
		return addEach(
			form.files,
			(file) => portfolio.addPhoto(locals.db, { actor, itemId: item.data.itemId, file }),
			item.data
		);
	},
	altText: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, altTextForm.extend(itemId.shape), (data) =>
			portfolio.setPhotoAltText(locals.db, { actor, ...data })
		);
	},
	movePhoto: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, moveForm.extend(itemId.shape), (data) =>
			portfolio.movePhoto(locals.db, { actor, ...data })
		);
	},
	removePhoto: async ({ locals, request }) => {
		const actor = requireRole('tailor');
		return photoFormAction(request, photoIdForm.extend(itemId.shape), (data) =>
			portfolio.removePhoto(locals.db, { actor, ...data })
		);
	}
};
