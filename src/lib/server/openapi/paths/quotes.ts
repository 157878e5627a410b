import { acceptRequestSchema, declineRequestSchema, quoteCreate, quotePatch } from '../../quotes/schemas';
import { acceptResponse, quoteListResponse, quoteResponse } from '../../quotes/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Quotes'];
const id = uuidPath('id');
const answer = jsonBody(quoteResponse, 'The quote.');

/** A body that may be left out altogether (or sent as `{}`). */
function optionalJson(...args: Parameters<typeof jsonRequest>) {
	return { ...jsonRequest(...args), required: false };
}

const paths: Paths = {
	'/api/v1/commissions/{id}/quotes': {
		get: {
			operationId: 'listCommissionQuotes',
			tags,
			summary: 'List the quotes on a commission',
			...access(
				'signedIn',
				'The commission’s owner (and administrators) see every quote, live ones first and then the history; a tailor sees only their own.'
			),
			requestParams: id,
			responses: { '200': jsonBody(quoteListResponse, 'The quotes the caller may see.'), ...errors(401, 404) }
		},
		post: {
			operationId: 'sendQuote',
			tags,
			summary: 'Quote on an open commission',
			...access(
				['tailor'],
				'For a workroom whose onboarding is complete, on an open commission; one waiting quote per tailor and commission (409 otherwise: change or withdraw it instead). `validUntil` is a moment with its offset, or a date meaning the end of that day (UTC). The answer carries `warnings` (a delivery after the date needed, a full diary around it) that never stop the quote; the customer is told by mail and a conversation opens.'
			),
			requestParams: id,
			requestBody: jsonRequest(quoteCreate),
			responses: {
				'201': {
					...jsonBody(quoteResponse, 'The quote sent, with its warnings.'),
					headers: { location: { description: 'The quote’s address.', schema: { type: 'string' } } }
				},
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/quotes/{id}': {
		get: {
			operationId: 'getQuote',
			tags,
			summary: 'Read a quote',
			...access('signedIn', 'For its tailor, the commission’s owner and administrators; anyone else gets 404.'),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 404) }
		},
		patch: {
			operationId: 'updateQuote',
			tags,
			summary: 'Change a quote’s terms',
			...access(
				['tailor'],
				'The quote’s tailor changes any of its fields (at least one) while it waits for an answer; the customer is told.'
			),
			requestParams: id,
			requestBody: jsonRequest(quotePatch),
			responses: {
				'200': jsonBody(quoteResponse, 'The changed quote, with its warnings.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/quotes/{id}/withdraw': {
		post: {
			operationId: 'withdrawQuote',
			tags,
			summary: 'Withdraw a quote',
			...access(['tailor'], 'The quote’s tailor takes it back while it waits for an answer; safe to repeat.'),
			requestParams: id,
			responses: { '200': answer, ...errors(401, 403, 404, 409) }
		}
	},
	'/api/v1/quotes/{id}/decline': {
		post: {
			operationId: 'declineQuote',
			tags,
			summary: 'Decline a quote',
			...access(
				['customer'],
				'The commission’s owner declines a live quote, optionally saying why; the tailor is mailed the reason. Declining again changes nothing. The body may be left out.'
			),
			requestParams: id,
			requestBody: optionalJson(declineRequestSchema),
			responses: { '200': jsonBody(quoteResponse, 'The declined quote.'), ...errors(400, 401, 403, 404, 409, 413, 415) }
		}
	},
	'/api/v1/quotes/{id}/accept': {
		post: {
			operationId: 'acceptQuote',
			tags,
			summary: 'Accept a quote',
			...access(
				['customer'],
				'The commission’s owner accepts a live quote, all at once: an order awaiting payment whose fee and payout add up to the price, every other live quote declined (each tailor told), and the commission awarded — from then on the tailor reads the full measurements. 409 when the commission is no longer open (another quote won, it was cancelled or it expired) or the quote is no longer live; nothing changes then. The body may be left out or sent as `{}`.'
			),
			requestParams: id,
			requestBody: optionalJson(acceptRequestSchema),
			responses: {
				'201': jsonBody(acceptResponse, 'The order the acceptance made.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	}
};

export const quotesArea: Area = {
	tag: {
		name: 'Quotes',
		description:
			'What a tailor offers for a commission — price, delivery date, fittings, fabric — and the customer’s answer: decline, or accept and make an order.'
	},
	paths
};
