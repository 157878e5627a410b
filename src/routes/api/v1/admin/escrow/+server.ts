import { json } from '@sveltejs/kit';
import { requireRole } from '$lib/server/auth/guard';
import * as payments from '$lib/server/payments';
import type { RequestHandler } from './$types';

/** Administrators: escrow totals per currency, reconciled against the processor's balance. */
export const GET: RequestHandler = async ({ locals }) => {
	requireRole('admin');
	const reconciliation = await payments.escrow.reconcile(locals.db);
	return json(payments.escrow.escrowJson(reconciliation), { headers: { 'cache-control': 'no-store' } });
};
