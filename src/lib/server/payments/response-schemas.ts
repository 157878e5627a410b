import { z } from 'zod';
import { deliveryMethod, orderStatus, progressStepKind } from '../db/schema';

/* The JSON answers of /api/v1/orders/… and /api/v1/webhooks/stripe, as `orderView`, `startCheckout` and `handleEvent` give them. */

const minor = (description: string) => z.int().meta({ description: `${description} In minor units.` });

/** What the ledger says happened to an order's money (`moneyOf`). */
export const orderMoneyResponse = z
	.object({
		chargedMinor: minor('Taken from the customer.'),
		heldMinor: minor('Held in escrow now.'),
		advancedMinor: minor('Paid to the tailor ahead of delivery.'),
		releasedMinor: minor('Paid to the tailor on release.'),
		refundedMinor: minor('Returned to the customer.'),
		feeMinor: minor('Kept by Tackline as its fee.')
	})
	.meta({ id: 'OrderMoney', description: 'The order’s money as the ledger has it, in the order’s currency.' });

const at = (description: string) => z.iso.datetime().nullable().meta({ description });

/** One progress step the tailor posted. */
export const progressStepResponse = z
	.object({
		id: z.uuid(),
		step: z.enum(progressStepKind.enumValues),
		note: z.string(),
		recordedAt: z.iso.datetime(),
		photo: z
			.object({ width: z.int(), height: z.int(), alt: z.string() })
			.nullable()
			.meta({ description: 'The photo posted with the step, if any (shown on the order page).' })
	})
	.meta({ id: 'ProgressStep' });

/** `GET /api/v1/orders/{id}` → 200 (`orderView`). */
export const orderResponse = z
	.object({
		id: z.uuid(),
		commissionId: z.uuid(),
		customerId: z.uuid(),
		tailorId: z.uuid(),
		status: z.enum(orderStatus.enumValues),
		priceMinor: minor('The accepted price.'),
		platformFeeMinor: minor('Tackline’s fee.'),
		tailorPayoutMinor: minor('What the tailor is paid: price less fee.'),
		currency: z.string().length(3).meta({ description: 'ISO 4217 code.' }),
		dueDate: z.iso.date(),
		fundedAt: z.iso.datetime().nullable().meta({ description: 'When the payment arrived; null until then.' }),
		money: orderMoneyResponse,
		lastPaymentFailure: z
			.object({ message: z.string(), at: z.iso.datetime() })
			.nullable()
			.meta({ description: 'The latest failed attempt to pay, while the order is not yet funded.' }),
		advanceMinor: minor('The materials advance agreed in the quote; 0 when there is none.'),
		fabricApprovedAt: at('When the customer approved the fabric, which pays the advance.'),
		workStartedAt: at('When the first step of the work was posted.'),
		readyAt: at('When the tailor marked the garment ready.'),
		deliveredAt: at('When the tailor marked it delivered (the latest time, after an alteration).'),
		delivery: z
			.object({
				method: z.enum(deliveryMethod.enumValues),
				trackingReference: z.string().nullable(),
				note: z.string()
			})
			.nullable()
			.meta({ description: 'How the garment was handed over; null until delivered.' }),
		autoReleaseAt: at('When the payment is released on its own; null while no release clock runs.'),
		alteration: z
			.object({ requestedAt: z.iso.datetime(), note: z.string() })
			.nullable()
			.meta({ description: 'An open alteration request: the release clock waits until the tailor delivers again.' }),
		releaseRequestedAt: at('When release was asked for; the transfer may still be on its way.'),
		releasedAt: at('When the payout reached the tailor’s account.'),
		cancellation: z
			.object({
				cancelledAt: at('When the order was cancelled (or the cancellation agreed).'),
				reason: z.string(),
				refundRequestedAt: at('When a refund was asked for by agreement; the refund may still be on its way.'),
				request: z
					.object({ by: z.enum(['customer', 'tailor']), at: z.iso.datetime(), reason: z.string() })
					.nullable()
					.meta({ description: 'One side’s open request to cancel a paid order, waiting for the other.' })
			})
			.meta({ description: 'Cancellation and refund state.' }),
		progress: z.array(progressStepResponse).meta({ description: 'The tailor’s progress steps, oldest first.' })
	})
	.meta({ id: 'Order' });

/** `POST /api/v1/orders/{id}/checkout` → 201. */
export const checkoutResponse = z
	.object({
		url: z.url().meta({ description: 'The payment processor’s hosted payment page; send the customer there.' })
	})
	.meta({ id: 'Checkout' });

/** `POST /api/v1/webhooks/stripe` → 200. */
export const webhookResponse = z
	.object({
		received: z.literal(true),
		outcome: z.enum(['applied', 'duplicate', 'ignored']).meta({
			description: '`applied` changed the order; `duplicate` was handled before; `ignored` is a type we do not use.'
		})
	})
	.meta({ id: 'WebhookReceipt' });
