import { randomUUID } from 'node:crypto';
import { and, eq, lt, ne } from 'drizzle-orm';
import type { Executor } from '../db';
import { session } from '../db/schema';

/** Every signed-in browser has a row; the token names it, and a session without its row is over. */
export async function startSession(db: Executor, { userId, expires }: { userId: string; expires: Date }) {
	const sessionId = randomUUID();
	await db.delete(session).where(and(eq(session.userId, userId), lt(session.expires, new Date())));
	await db.insert(session).values({ sessionToken: sessionId, userId, expires });
	return sessionId;
}

export async function endSession(db: Executor, { sessionId }: { sessionId: string }) {
	await db.delete(session).where(eq(session.sessionToken, sessionId));
}

/** Ends every session of the user, or every one but `except`. Returns how many ended. */
export async function endSessionsOf(db: Executor, { userId, except }: { userId: string; except?: string | null }) {
	const ended = await db
		.delete(session)
		.where(except ? and(eq(session.userId, userId), ne(session.sessionToken, except)) : eq(session.userId, userId))
		.returning({ id: session.sessionToken });
	return ended.length;
}
