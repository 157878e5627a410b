import { altTextBody, orderBody, portfolioItemBody } from '../../photos/api';
import {
	photoResponse,
	portfolioItemListResponse,
	portfolioItemResponse,
	portfolioResponse
} from '../../photos/response-schemas';
import { workroomReplace } from '../../workrooms/schemas';
import { publicWorkroomResponse, workroomAnswer } from '../../workrooms/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths, photoUpload } from '../common';
import type { Area } from '../registry';

const tags = ['Workrooms'];
const tailorOnly = (description: string) => access(['tailor'], description);
const item = uuidPath('itemId');
const itemPhoto = uuidPath('itemId', 'photoId');

const upload = photoUpload('What the photo shows.');

const paths: Paths = {
	'/api/v1/workroom': {
		get: {
			operationId: 'getOwnWorkroom',
			tags,
			summary: 'Read your workroom',
			...tailorOnly(
				'Your workroom, exact place and rates included, and the onboarding steps still missing. 404 before it is started.'
			),
			responses: { '200': jsonBody(workroomAnswer, 'Your workroom.'), ...errors(401, 403, 404) }
		},
		put: {
			operationId: 'replaceOwnWorkroom',
			tags,
			summary: 'Set up or replace your workroom',
			...tailorOnly(
				'Replaces every onboarding field (the first call makes the workroom). `location` is a place id from GET /api/v1/places or a point, stored coarsened to about a kilometre.'
			),
			requestBody: jsonRequest(workroomReplace),
			responses: { '200': jsonBody(workroomAnswer, 'The saved workroom.'), ...errors(400, 401, 403, 413, 415) }
		}
	},
	'/api/v1/workroom/portfolio': {
		get: {
			operationId: 'listPortfolio',
			tags,
			summary: 'List your portfolio',
			...tailorOnly('Items in order, each with its photos.'),
			responses: { '200': jsonBody(portfolioResponse, 'Your portfolio.'), ...errors(401, 403) }
		},
		post: {
			operationId: 'createPortfolioItem',
			tags,
			summary: 'Add a portfolio item',
			...tailorOnly('An empty item; add its photos next.'),
			requestBody: jsonRequest(portfolioItemBody),
			responses: {
				'201': jsonBody(portfolioItemResponse, 'The new item.'),
				...errors(400, 401, 403, 409, 413, 415)
			}
		},
		patch: {
			operationId: 'reorderPortfolio',
			tags,
			summary: 'Reorder your portfolio',
			...tailorOnly('Name every item once, in the new order.'),
			requestBody: jsonRequest(orderBody),
			responses: {
				'200': jsonBody(portfolioItemListResponse, 'The items in their new order.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/workroom/portfolio/{itemId}': {
		patch: {
			operationId: 'updatePortfolioItem',
			tags,
			summary: 'Change a portfolio item',
			...tailorOnly('Its caption and garment.'),
			requestParams: item,
			requestBody: jsonRequest(portfolioItemBody),
			responses: { '200': jsonBody(portfolioItemResponse, 'The item.'), ...errors(400, 401, 403, 404, 413, 415) }
		},
		delete: {
			operationId: 'removePortfolioItem',
			tags,
			summary: 'Remove a portfolio item',
			...tailorOnly('With its photos.'),
			requestParams: item,
			responses: { '204': { description: 'Removed.' }, ...errors(401, 403, 404) }
		}
	},
	'/api/v1/workroom/portfolio/{itemId}/photos': {
		post: {
			operationId: 'addPortfolioPhoto',
			tags,
			summary: 'Add a photo to a portfolio item',
			...tailorOnly('Re-encoded on arrival (metadata and location removed); the type is judged by content.'),
			requestParams: item,
			requestBody: upload,
			responses: {
				'201': jsonBody(photoResponse, 'The stored photo.'),
				...errors(400, 401, 403, 404, 409, 413, 415, 422)
			}
		},
		patch: {
			operationId: 'reorderPortfolioPhotos',
			tags,
			summary: 'Reorder an item’s photos',
			...tailorOnly('Name every photo of the item once, in the new order.'),
			requestParams: item,
			requestBody: jsonRequest(orderBody),
			responses: {
				'200': jsonBody(portfolioItemResponse, 'The item.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/workroom/portfolio/{itemId}/photos/{photoId}': {
		patch: {
			operationId: 'describePortfolioPhoto',
			tags,
			summary: 'Change a portfolio photo’s alt text',
			...tailorOnly('The text read out in place of the photo.'),
			requestParams: itemPhoto,
			requestBody: jsonRequest(altTextBody),
			responses: { '200': jsonBody(photoResponse, 'The photo.'), ...errors(400, 401, 403, 404, 413, 415) }
		},
		delete: {
			operationId: 'removePortfolioPhoto',
			tags,
			summary: 'Remove a portfolio photo',
			...tailorOnly('The stored files go with it.'),
			requestParams: itemPhoto,
			responses: { '204': { description: 'Removed.' }, ...errors(401, 403, 404) }
		}
	},
	'/api/v1/tailors/{id}': {
		get: {
			operationId: 'getTailor',
			tags,
			summary: 'A tailor’s public workroom',
			...access(
				'public',
				'What anyone may see: the town (never the point), specialties with lead times, portfolio and review figures. 404 until onboarding is complete, and while the account is suspended.'
			),
			requestParams: uuidPath('id'),
			responses: { '200': jsonBody(publicWorkroomResponse, 'The public workroom.'), ...errors(404) }
		}
	}
};

export const workroomsArea: Area = {
	tag: {
		name: 'Workrooms',
		description: 'A tailor’s workroom: onboarding, portfolio, and the public view customers see.'
	},
	paths
};
