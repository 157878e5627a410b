import { z } from 'zod';

/* The answer of `GET /api/v1/admin/escrow`, as `escrowJson` builds it. */

const minor = (description: string) => z.int().meta({ description: `${description} In the currency’s minor unit.` });

export const escrowCurrencyResponse = z
	.object({
		currency: z.string().length(3).meta({ description: 'ISO 4217 code.' }),
		heldMinor: minor('What escrow holds for orders not yet released or refunded.'),
		releasedMinor: minor('What was transferred to tailors: fabric advances and releases.'),
		refundedMinor: minor('What was refunded to customers.'),
		feesMinor: minor('The platform fees kept.'),
		processorBalanceMinor: z.int().nullable().meta({
			description:
				'The payment processor’s balance of the platform account in this currency, available plus pending; null when the processor could not be asked.'
		}),
		difference: z.int().nullable().meta({
			description:
				'processorBalanceMinor − (heldMinor + feesMinor): what the processor holds beyond what the books say it should. 0 when they agree; null when the processor could not be asked.'
		})
	})
	.meta({ id: 'EscrowCurrency' });

export const escrowResponse = z
	.object({
		currencies: z
			.array(escrowCurrencyResponse)
			.meta({ description: 'One row per currency the ledger or the processor has money in, by code.' }),
		processorAvailable: z.boolean().meta({
			description:
				'False when the payment processor could not be reached: the ledger totals still stand, the balances and differences are null.'
		})
	})
	.meta({ id: 'EscrowTotals' });
