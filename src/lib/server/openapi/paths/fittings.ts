import { cancelRequest, offerRequest } from '../../fittings/schemas';
import { fittingListResponse, fittingResponse } from '../../fittings/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Fittings'];
const id = uuidPath('id');
const answer = jsonBody(fittingResponse, 'The fitting as the caller now sees it.');

const paths: Paths = {
	'/api/v1/orders/{id}/fittings': {
		get: {
			operationId: 'listOrderFittings',
			tags,
			summary: 'List an order’s fittings',
			...access(
				'signedIn',
				'For the order’s customer and tailor; anyone else gets 404. Every time, offered, booked, done or cancelled, in start order, with `when` in the caller’s own zone first.'
			),
			requestParams: id,
			responses: { '200': jsonBody(fittingListResponse, 'The order’s fittings.'), ...errors(401, 404) }
		},
		post: {
			operationId: 'offerFittings',
			tags,
			summary: 'Offer fitting times',
			...access(
				['tailor'],
				'The order’s tailor offers one to six times on a paid order that is not yet delivered: each a wall-clock start in `timeZone` (the tailor’s account zone when left out), 15–180 minutes long, at the workroom or a named public place, in the future and not overlapping another open or booked time of the order (409). The customer is told.'
			),
			requestParams: id,
			requestBody: jsonRequest(offerRequest),
			responses: {
				'201': jsonBody(fittingListResponse, 'The times offered.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/fittings/{id}/book': {
		post: {
			operationId: 'bookFitting',
			tags,
			summary: 'Book a fitting time',
			...access(
				['customer'],
				'The order’s customer books an open time up to the cut-off before it starts (409 `too_late` after it). With a booking already ahead, this moves it: the old time is open again. Both people get the calendar file by mail. Safe to repeat.'
			),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 403, 404, 409) }
		}
	},
	'/api/v1/fittings/{id}/cancel': {
		post: {
			operationId: 'cancelFitting',
			tags,
			summary: 'Cancel or withdraw a fitting',
			...access(
				['customer', 'tailor'],
				'The customer cancels their booking up to the cut-off (409 `too_late` after it). The tailor withdraws an open time, or cancels a booking at any time with a `reason` (400 without one); the customer is told. The body may be left out. Safe to repeat.'
			),
			requestParams: id,
			requestBody: { ...jsonRequest(cancelRequest), required: false },
			responses: { '200': answer, ...errors(400, 401, 403, 404, 409, 413, 415) }
		}
	},
	'/api/v1/fittings/{id}/done': {
		post: {
			operationId: 'completeFitting',
			tags,
			summary: 'Mark a fitting done',
			...access(['tailor'], 'The order’s tailor marks a booked fitting done once it has started. Safe to repeat.'),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 403, 404, 409) }
		}
	}
};

export const fittingsArea: Area = {
	tag: {
		name: 'Fittings',
		description:
			'Times the tailor offers to see the customer, the one the customer books, and its calendar file. Times are instants with the zone they were offered in.'
	},
	paths
};
