import { escrowResponse } from '../../payments/escrow-schemas';
import { access, errors, jsonBody, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Administration'];

const paths: Paths = {
	'/api/v1/admin/escrow': {
		get: {
			operationId: 'getEscrowTotals',
			tags,
			summary: 'Escrow totals and reconciliation',
			...access(
				['admin'],
				'Per currency, from the double-entry ledger: what escrow holds, what went to tailors (advances and releases), what was refunded, and the fees kept; beside it the payment processor’s balance of the platform account (available plus pending). The processor should hold exactly escrow plus fees, so `difference` is 0 when the books agree. When the processor cannot be reached the answer is still 200 with the ledger totals, `processorAvailable: false`, and `processorBalanceMinor` and `difference` null. Signed-in people who are not administrators get 403.'
			),
			responses: {
				'200': jsonBody(escrowResponse, 'The totals per currency, reconciled.'),
				...errors(401, 403)
			}
		}
	}
};

export const adminArea: Area = {
	tag: {
		name: 'Administration',
		description: 'For Tackline’s administrators: the books.'
	},
	paths
};
