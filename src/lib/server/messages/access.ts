import { sql } from 'drizzle-orm';
import type { Executor } from '../db';

export type Participant = { id: string };

/** What every message action needs to know about a thread, and which side the viewer is on. */
export type ThreadFacts = {
	id: string;
	commissionId: string;
	commissionTitle: string;
	commissionStatus: string;
	customerId: string;
	tailorId: string;
	awardedTailorId: string | null;
};

export type Side = 'customer' | 'tailor';

// The commissions and quotes areas export no lookup of a commission's owner and awarded tailor by thread;
// this is the one read messages make of their tables (by primary key and the quote's commission index).
export async function threadFacts(
	db: Executor,
	threadId: string,
	options: { lock?: boolean } = {}
): Promise<ThreadFacts | null> {
	const lock = options.lock ? sql`for update of t` : sql``;
	const result = await db.execute<ThreadFacts>(sql`
		select t.id, t.commission_id as "commissionId", c.title as "commissionTitle", c.status as "commissionStatus",
			c.customer_id as "customerId", t.tailor_id as "tailorId",
			(select q.tailor_id from quote q where q.commission_id = c.id and q.status = 'accepted' limit 1)
				as "awardedTailorId"
		from message_thread t join commission c on c.id = t.commission_id
		where t.id = ${threadId}
		${lock}`);
	return result.rows[0] ?? null;
}

/** The viewer's side of the thread, or null when they take no part in it (they are told it does not exist). */
export function sideOf(facts: ThreadFacts, viewer: Participant): Side | null {
	if (viewer.id === facts.customerId) return 'customer';
	if (viewer.id === facts.tailorId) return 'tailor';
	return null;
}

/**
 * Whether the thread still takes messages: while the commission is open, and afterwards between the
 * customer and the tailor it was awarded to. Other threads stay readable.
 */
export function openness(facts: ThreadFacts, side: Side): { open: boolean; closedReason: string | null } {
	const status = facts.commissionStatus;
	if (status === 'open') return { open: true, closedReason: null };
	if ((status === 'awarded' || status === 'closed') && facts.awardedTailorId === facts.tailorId)
		return { open: true, closedReason: null };
	if (status === 'awarded' || status === 'closed')
		return {
			open: false,
			closedReason:
				side === 'tailor'
					? 'The customer chose another workroom for this commission, so this conversation is closed.'
					: 'You chose another workroom for this commission, so this conversation is closed.'
		};
	if (status === 'cancelled')
		return { open: false, closedReason: 'The commission was cancelled, so this conversation is closed.' };
	return { open: false, closedReason: 'The commission closed without a tailor, so this conversation is closed.' };
}

/** Whether the person may act: a suspended account can neither read nor write. */
export async function isSuspended(db: Executor, userId: string) {
	const result = await db.execute<{ suspended: boolean }>(
		sql`select suspended_at is not null as suspended from "user" where id = ${userId}`
	);
	return result.rows[0]?.suspended ?? true;
}
