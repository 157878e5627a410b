import { z } from 'zod';
import { checkoutRequest } from '../../payments/schemas';
import { alterationRequest, cancelRequest, deliverRequest, emptyRequest, progressRequest } from '../../orders/schemas';
import {
	checkoutResponse,
	orderResponse,
	progressStepResponse,
	webhookResponse
} from '../../payments/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Orders and payment'];
const id = uuidPath('id');

/** The processor's event as it sends it; only the fields we read are spelled out. */
const stripeEvent = z
	.looseObject({
		id: z
			.string()
			.meta({ description: 'The event’s id (`evt_…`); an event is applied once however often it arrives.' }),
		object: z.literal('event'),
		type: z.string().meta({ description: 'Such as `checkout.session.completed`.' }),
		created: z.int().meta({ description: 'Unix seconds.' }),
		data: z.looseObject({ object: z.looseObject({}) })
	})
	.meta({ description: 'A Stripe Event object, exactly as Stripe sent it: the signature covers the raw bytes.' });

const paths: Paths = {
	'/api/v1/orders/{id}': {
		get: {
			operationId: 'getOrder',
			tags,
			summary: 'Read an order',
			...access(
				'signedIn',
				'For the order’s customer and tailor, and administrators; anyone else gets 404. `money` is read from the ledger: charged, held in escrow, advanced and released to the tailor, refunded, and the fee.'
			),
			requestParams: id,
			responses: { '200': jsonBody(orderResponse, 'The order with its money.'), ...errors(401, 404) }
		}
	},
	'/api/v1/orders/{id}/checkout': {
		post: {
			operationId: 'checkoutOrder',
			tags,
			summary: 'Pay for an order',
			...access(
				'signedIn',
				'The order’s customer starts paying: the answer is the hosted payment page to send them to (a second call gives the same open page). The order’s tailor and administrators get 403; anyone else 404. 409 when the order is not awaiting payment (paid or cancelled); 503 when the payment service is not answering, with nothing charged. The body may be left out or sent as `{}`.'
			),
			requestParams: id,
			requestBody: { ...jsonRequest(checkoutRequest), required: false },
			responses: {
				'201': jsonBody(checkoutResponse, 'Where the customer pays.'),
				...errors(400, 401, 403, 404, 409, 413, 415, 503)
			}
		}
	},
	'/api/v1/orders/{id}/progress': {
		post: {
			operationId: 'postOrderProgress',
			tags,
			summary: 'Post a progress step',
			...access(
				'signedIn',
				'The order’s tailor tells the customer how the work goes, while the order is funded, in work or ready. The first step other than `fabric_sourced` starts the work (`funded → in_work`). The same step and note again within a minute answers 200 with the first one. The customer gets 403; anyone else 404; 409 in any other state.'
			),
			requestParams: id,
			requestBody: jsonRequest(progressRequest),
			responses: {
				'201': jsonBody(progressStepResponse, 'The step as posted.'),
				'200': jsonBody(progressStepResponse, 'The same step, posted a moment ago.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/orders/{id}/deliver': {
		post: {
			operationId: 'deliverOrder',
			tags,
			summary: 'Mark an order delivered',
			...access(
				'signedIn',
				'The order’s tailor hands the garment over — `pickup` at the workroom, or `courier` with its tracking reference — from in work or ready. Starts the release clock (`autoReleaseAt`). Delivering again answers an open alteration request with a fresh clock; otherwise a repeat changes nothing. The customer gets 403; anyone else 404; 409 in any other state.'
			),
			requestParams: id,
			requestBody: jsonRequest(deliverRequest),
			responses: {
				'200': jsonBody(orderResponse, 'The order, delivered.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/orders/{id}/confirm': {
		post: {
			operationId: 'confirmOrderDelivery',
			tags,
			summary: 'Confirm delivery (release the payment)',
			...access(
				'signedIn',
				'The order’s customer confirms they have the garment, which releases the payment to the tailor: price less fee less any advance paid, transferred once however often this is called. 202 while the transfer is on its way (`releaseRequestedAt`), 200 once the order is `released`. The tailor and administrators get 403; anyone else 404; 409 before delivery. The body may be left out or sent as `{}`.'
			),
			requestParams: id,
			requestBody: { ...jsonRequest(emptyRequest), required: false },
			responses: {
				'202': jsonBody(orderResponse, 'Release asked for; the transfer is on its way.'),
				'200': jsonBody(orderResponse, 'Already released.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/orders/{id}/cancel': {
		post: {
			operationId: 'cancelOrder',
			tags,
			summary: 'Cancel an order',
			...access(
				'signedIn',
				'An unpaid order is cancelled at once by either party (or an administrator): the commission opens again and the quotes its acceptance declined are sent again while still valid. A paid order before work starts is cancelled by agreement: the first party’s call asks (`cancellation.request`), the other party’s call agrees and the whole payment is refunded (202 while the refund is on its way; a paid advance is reversed first). `decline: true` turns a request down, or withdraws your own. Once work has started, 409: later cancellations go through disputes. Anyone but the parties gets 404.'
			),
			requestParams: id,
			requestBody: { ...jsonRequest(cancelRequest), required: false },
			responses: {
				'200': jsonBody(orderResponse, 'Cancelled, asked for, declined, or already so.'),
				'202': jsonBody(orderResponse, 'Cancellation agreed; the refund is on its way.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/orders/{id}/alteration': {
		post: {
			operationId: 'requestOrderAlteration',
			tags,
			summary: 'Ask for an alteration',
			...access(
				'signedIn',
				'The order’s customer asks for something to be changed after delivery. The order stays `delivered` and its release clock pauses until the tailor delivers again; asking again while a request is open changes nothing. The tailor and administrators get 403; anyone else 404; 409 before delivery or after release was asked for.'
			),
			requestParams: id,
			requestBody: jsonRequest(alterationRequest),
			responses: {
				'200': jsonBody(orderResponse, 'The order, with the alteration request.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/orders/{id}/fabric-approval': {
		post: {
			operationId: 'approveOrderFabric',
			tags,
			summary: 'Approve the fabric (pay the advance)',
			...access(
				'signedIn',
				'The order’s customer approves the fabric the tailor showed (a `fabric_sourced` step with a photo), which pays the materials advance agreed in the quote; the final release deducts it. 202 while the transfer is on its way, 200 once paid. 409 when the order has no advance, the fabric has not been shown, or the order is past work. The tailor and administrators get 403; anyone else 404. The body may be left out or sent as `{}`.'
			),
			requestParams: id,
			requestBody: { ...jsonRequest(emptyRequest), required: false },
			responses: {
				'202': jsonBody(orderResponse, 'Approved; the advance is on its way.'),
				'200': jsonBody(orderResponse, 'Approved, and the advance paid.'),
				...errors(400, 401, 403, 404, 409, 413, 415)
			}
		}
	},
	'/api/v1/webhooks/stripe': {
		post: {
			operationId: 'receiveStripeEvent',
			tags,
			summary: 'Payment processor events',
			...access(
				'public',
				'For the payment processor, not for people. The raw body is checked against the `Stripe-Signature` header with the endpoint’s signing secret; a missing or bad signature, a timestamp more than five minutes old, or a body over 256 KB is 400 and changes nothing. A verified event is applied once; replays, duplicates and event types we do not use are acknowledged with 200.'
			),
			requestParams: {
				header: z.object({
					'stripe-signature': z.string().meta({
						description: 'Stripe’s signature of the raw body: `t=<unix seconds>,v1=<HMAC-SHA256 hex>`.'
					})
				})
			},
			requestBody: jsonRequest(stripeEvent, 'The Stripe Event object.'),
			responses: { '200': jsonBody(webhookResponse, 'The event was received.'), ...errors(400) }
		}
	}
};

export const paymentsArea: Area = {
	tag: {
		name: 'Orders and payment',
		description:
			'The order an accepted quote makes, paying for it through the payment processor’s hosted page, and the processor’s signed events.'
	},
	paths
};
