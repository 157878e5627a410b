import { z } from 'zod';
import { checkoutRequest } from '../../payments/schemas';
import { checkoutResponse, orderResponse, webhookResponse } from '../../payments/response-schemas';
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
