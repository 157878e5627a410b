import { and, eq } from 'drizzle-orm';
import type { Executor } from '../db';
import { commission, quote, type CommissionStatus } from '../db/schema';

export type CommissionFacts = { customerId: string; status: CommissionStatus; awardedTailorId: string | null };

// The commissions area exports no lookup of these three facts yet; this is the one query photos make
// against its tables (owner, status, and the tailor of the accepted quote).
/** Who owns a commission, its status and its awarded tailor; `lock` holds the row until the transaction ends. */
export async function commissionFacts(
	db: Executor,
	commissionId: string,
	options: { lock?: boolean } = {}
): Promise<CommissionFacts | null> {
	const query = db
		.select({ customerId: commission.customerId, status: commission.status })
		.from(commission)
		.where(eq(commission.id, commissionId));
	const [row] = options.lock ? await query.for('update') : await query;
	if (!row) return null;
	const [awarded] = await db
		.select({ tailorId: quote.tailorId })
		.from(quote)
		.where(and(eq(quote.commissionId, commissionId), eq(quote.status, 'accepted')))
		.limit(1);
	return { ...row, awardedTailorId: awarded?.tailorId ?? null };
}
