import { z } from 'zod';
import { orderStatus } from '../db/schema';

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
			.meta({ description: 'The latest failed attempt to pay, while the order is not yet funded.' })
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
