/** Paid orders ready for fittings, with each person in the time zone a test needs. */
import { eq } from 'drizzle-orm';
import type { Executor } from '../../src/lib/server/db/client';
import { order, user } from '../../src/lib/server/db/schema';
import { createCommission, createUser } from './index';
import { awardQuote, createQuotingWorkroom, insertQuote } from './quotes';

export type FundedOrder = {
	orderId: string;
	customer: { id: string; email: string; password: string };
	tailor: { id: string; email: string; password: string; shopName: string };
};

/** An accepted quote's order marked `funded` (as the payment webhook leaves it), the two people in the zones given. */
export async function createFundedOrder(
	db: Executor,
	{ customerZone = 'Europe/London', tailorZone = 'Europe/London' }: { customerZone?: string; tailorZone?: string } = {}
): Promise<FundedOrder> {
	const customer = await createUser(db, { name: 'Wenna Polglase' });
	const tailor = await createQuotingWorkroom(db);
	await db.update(user).set({ timeZone: customerZone }).where(eq(user.id, customer.id));
	await db.update(user).set({ timeZone: tailorZone }).where(eq(user.id, tailor.id));
	const { id: commissionId } = await createCommission(db, { customerId: customer.id, status: 'open' });
	const { id: quoteId } = await insertQuote(db, { commissionId, tailorId: tailor.id });
	const { orderId } = await awardQuote(db, { commissionId, quoteId, customerId: customer.id });
	await db.update(order).set({ status: 'funded', fundedAt: new Date() }).where(eq(order.id, orderId));
	return { orderId, customer, tailor };
}
