import { error } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import { commissionPhotos } from '$lib/server/photos';
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
import { loadStep } from '../step.server';

export const load: PageServerLoad = async ({ params, locals }) => {
	const actor = requireRole('customer');
	const editor = await commissionPhotos.forOwner(locals.db, { commissionId: params.id, actor });
	if (!editor) error(404, { message: 'There is no such commission.', code: 'not_found' });
	const { done, isOpen } = await loadStep(locals, params.id);
	return { commissionId: params.id, limit: photoLimits.commission, done, isOpen, ...editor };
};

export const actions: Actions = {
	upload: async ({ params, locals, request }) => {
		const actor = requireRole('customer');
		const form = await readUploadForm(request);
		if (!form.ok) return form.failure;
		return addEach(form.files, (file) => commissionPhotos.add(locals.db, { commissionId: params.id, actor, file }));
	},
	altText: async ({ params, locals, request }) => {
		const actor = requireRole('customer');
		return photoFormAction(request, altTextForm, (data) =>
			commissionPhotos.setAltText(locals.db, { commissionId: params.id, actor, ...data })
		);
	},
	movePhoto: async ({ params, locals, request }) => {
		const actor = requireRole('customer');
		return photoFormAction(request, moveForm, (data) =>
			commissionPhotos.move(locals.db, { commissionId: params.id, actor, ...data })
		);
	},
	removePhoto: async ({ params, locals, request }) => {
		const actor = requireRole('customer');
		return photoFormAction(request, photoIdForm, (data) =>
			commissionPhotos.remove(locals.db, { commissionId: params.id, actor, ...data })
		);
	}
};
