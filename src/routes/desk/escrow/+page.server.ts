import { z } from 'zod';
import { requireRole } from '$lib/server/auth/guard';
import * as payments from '$lib/server/payments';
import { currenciesWithMoney } from './shown';
import type { PageServerLoad } from './$types';

const pageSize = 25;
const query = z.object({ from: z.coerce.number().int().min(0).max(1_000_000).catch(0) });

export const load: PageServerLoad = async ({ locals, url }) => {
	requireRole('admin');
	const { from } = query.parse({ from: url.searchParams.get('from') ?? undefined });
	const [reconciliation, unbalanced, stuck] = await Promise.all([
		payments.escrow.reconcile(locals.db),
		payments.escrow.unbalancedOrders(locals.db, { limit: pageSize, offset: from }),
		payments.escrow.stuckMoney(locals.db)
	]);
	return {
		checkedAt: new Date().toISOString(),
		reconciliation: { ...reconciliation, currencies: currenciesWithMoney(reconciliation.currencies) },
		unbalanced: {
			total: unbalanced.total,
			from,
			orders: unbalanced.orders.map((o) => ({
				orderId: o.orderId,
				commissionId: o.order?.commissionId ?? null,
				status: o.order?.status ?? null,
				currency: o.currency,
				chargedMinor: o.chargedMinor,
				heldMinor: o.heldMinor,
				releasedMinor: o.releasedMinor,
				refundedMinor: o.refundedMinor,
				feesMinor: o.feesMinor,
				problems: o.problems
			})),
			nextFrom: from + pageSize < unbalanced.total ? from + pageSize : null
		},
		stuck: stuck.map((s) => ({
			orderId: s.id,
			status: s.status,
			currency: s.currency,
			heldMinor: s.heldMinor,
			waiting: s.waiting,
			requestedAt: (s.waiting === 'refund' ? s.refundRequestedAt : s.releaseRequestedAt)?.toISOString() ?? null
		})),
		stuckAfterMinutes: payments.escrow.stuckAfterMs / 60_000
	};
};
