import { describe, expect, it } from 'vitest';
import type { CurrencyReconciliation } from '$lib/types/escrow';
import { currenciesWithMoney } from './shown';

const zero = (currency: string, processorBalanceMinor: number | null = 0): CurrencyReconciliation => ({
	currency,
	chargedMinor: 0,
	heldMinor: 0,
	releasedMinor: 0,
	refundedMinor: 0,
	feesMinor: 0,
	processorBalanceMinor,
	difference: processorBalanceMinor === null ? null : processorBalanceMinor
});

describe('currenciesWithMoney', () => {
	it('leaves out a currency with nothing in the ledger and nothing at the processor', () => {
		expect(currenciesWithMoney([zero('USD'), zero('GBP', null)])).toEqual([]);
	});

	it('keeps a currency with any ledger figure, whatever the processor says', () => {
		const paid = { ...zero('EUR'), chargedMinor: 5_000, heldMinor: 5_000, processorBalanceMinor: 5_000, difference: 0 };
		const refunded = { ...zero('GBP'), chargedMinor: 900, refundedMinor: 900 };
		expect(currenciesWithMoney([paid, zero('USD'), refunded]).map((c) => c.currency)).toEqual(['EUR', 'GBP']);
	});

	it('keeps a currency only the processor holds money in, since that is a difference to look at', () => {
		const stray = zero('CHF', 1_234);
		expect(currenciesWithMoney([stray])).toEqual([stray]);
	});
});
