import { altTextBody, orderBody } from '../../photos/api';
import { apiCreate, apiPatch } from '../../commissions/schemas';
import { commissionResponse } from '../../commissions/response-schemas';
import { photoListResponse, photoResponse } from '../../photos/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths, photoUpload } from '../common';
import type { Area } from '../registry';

const tags = ['Commissions'];
const id = uuidPath('id');
const photo = uuidPath('id', 'photoId');
const answer = jsonBody(commissionResponse, 'The commission as the caller may see it.');

const upload = photoUpload('What the photo shows, for people who cannot see it.');

const paths: Paths = {
	'/api/v1/commissions': {
		post: {
			operationId: 'createCommission',
			tags,
			summary: 'Start a draft commission',
			...access(['customer'], 'Only `garment` and `title` are required; the rest can follow with PATCH.'),
			requestBody: jsonRequest(apiCreate),
			responses: {
				'201': jsonBody(commissionResponse, 'The new draft.'),
				...errors(400, 401, 403, 413, 415, 422)
			}
		}
	},
	'/api/v1/commissions/{id}': {
		get: {
			operationId: 'getCommission',
			tags,
			summary: 'Read a commission',
			...access(
				'signedIn',
				'The owner sees everything, measurements included; the tailor whose quote was accepted sees the frozen measurements too, beside a fabric estimate. Any other tailor sees an open commission (or one they quoted on) with its size band and a fabric estimate, never the measurements. Drafts are the owner’s alone.'
			),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 404) }
		},
		patch: {
			operationId: 'updateCommission',
			tags,
			summary: 'Change a draft or an open commission',
			...access(
				['customer'],
				'A draft saves whatever is sent; an open commission takes every field but the garment and the measurements, and each tailor with a live quote is told of the change.'
			),
			requestParams: id,
			requestBody: jsonRequest(apiPatch),
			responses: { '200': answer, ...errors(400, 401, 403, 404, 409, 413, 415, 422) }
		}
	},
	'/api/v1/commissions/{id}/publish': {
		post: {
			operationId: 'publishCommission',
			tags,
			summary: 'Publish a draft',
			...access(
				['customer'],
				'Freezes the chosen measurement profile and opens the commission to tailors. 422 lists what is still missing.'
			),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 403, 404, 409, 422) }
		}
	},
	'/api/v1/commissions/{id}/cancel': {
		post: {
			operationId: 'cancelCommission',
			tags,
			summary: 'Cancel a commission',
			...access(['customer'], 'A draft or an open commission; safe to repeat.'),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 403, 404, 409) }
		}
	},
	'/api/v1/commissions/{id}/photos': {
		get: {
			operationId: 'listCommissionPhotos',
			tags,
			summary: 'List a commission’s photos',
			...access('signedIn', 'In their order, for anyone who may see the commission’s photos.'),
			requestParams: id,
			responses: { '200': jsonBody(photoListResponse, 'The photos in order.'), ...errors(401, 404) }
		},
		post: {
			operationId: 'addCommissionPhoto',
			tags,
			summary: 'Add a reference photo',
			...access(['customer'], 'Re-encoded on arrival (metadata and location removed); the type is judged by content.'),
			requestParams: id,
			requestBody: upload,
			responses: {
				'201': jsonBody(photoResponse, 'The stored photo.'),
				...errors(400, 401, 403, 404, 409, 413, 415, 422)
			}
		},
		patch: {
			operationId: 'reorderCommissionPhotos',
			tags,
			summary: 'Reorder a commission’s photos',
			...access(['customer'], 'Name every photo once, in the new order.'),
			requestParams: id,
			requestBody: jsonRequest(orderBody),
			responses: {
				'200': jsonBody(photoListResponse, 'The photos in their new order.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/commissions/{id}/photos/{photoId}': {
		patch: {
			operationId: 'describeCommissionPhoto',
			tags,
			summary: 'Change a photo’s alt text',
			...access(['customer'], 'The text read out in place of the photo.'),
			requestParams: photo,
			requestBody: jsonRequest(altTextBody),
			responses: { '200': jsonBody(photoResponse, 'The photo.'), ...errors(400, 401, 403, 404, 409, 413, 415) }
		},
		delete: {
			operationId: 'removeCommissionPhoto',
			tags,
			summary: 'Remove a photo',
			...access(['customer'], 'The stored files go with it.'),
			requestParams: photo,
			responses: { '204': { description: 'Removed.' }, ...errors(401, 403, 404, 409) }
		}
	}
};

export const commissionsArea: Area = {
	tag: {
		name: 'Commissions',
		description: 'What a customer wants made: drafts, publishing, changes while tailors quote, reference photos.'
	},
	paths
};
