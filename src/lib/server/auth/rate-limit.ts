import { and, eq, gt, sql } from 'drizzle-orm';
import { db } from '../db';
import { signInAttempt, verificationToken } from '../db/schema';

export const WINDOW_MINUTES = 15;
export const MAX_FAILURES_PER_ACCOUNT = 5;
export const MAX_FAILURES_PER_ADDRESS = 20;

export type SignInGate = { blocked: false } | { blocked: true; retryAfterMinutes: number };

async function failuresSince(column: typeof signInAttempt.email | typeof signInAttempt.ip, value: string, since: Date) {
	const [row] = await db
		.select({ count: sql<number>`count(*)::int`, oldest: sql<Date | null>`min(${signInAttempt.createdAt})` })
		.from(signInAttempt)
		.where(and(eq(column, value), eq(signInAttempt.succeeded, false), gt(signInAttempt.createdAt, since)));
	return { count: row?.count ?? 0, oldest: row?.oldest ? new Date(row.oldest) : null };
}

function retryAfter(oldest: Date | null) {
	const unblocksAt = (oldest?.getTime() ?? Date.now()) + WINDOW_MINUTES * 60_000;
	return Math.max(1, Math.ceil((unblocksAt - Date.now()) / 60_000));
}

/** Too many recent failures for this account, or from this address, block password sign-in for a while. */
export async function checkSignInGate({ email, ip }: { email: string; ip: string }): Promise<SignInGate> {
	const since = new Date(Date.now() - WINDOW_MINUTES * 60_000);
	const [byAccount, byAddress] = await Promise.all([
		failuresSince(signInAttempt.email, email.toLowerCase(), since),
		failuresSince(signInAttempt.ip, ip, since)
	]);
	if (byAccount.count >= MAX_FAILURES_PER_ACCOUNT)
		return { blocked: true, retryAfterMinutes: retryAfter(byAccount.oldest) };
	if (byAddress.count >= MAX_FAILURES_PER_ADDRESS)
		return { blocked: true, retryAfterMinutes: retryAfter(byAddress.oldest) };
	return { blocked: false };
}

export async function recordAttempt({ email, ip, succeeded }: { email: string; ip: string; succeeded: boolean }) {
	await db.insert(signInAttempt).values({ email: email.toLowerCase(), ip, succeeded });
}

export const MAX_LINKS_PER_WINDOW = 5;
const LINK_LIFETIME_MINUTES = 24 * 60;

/** Sign-in links live 24 hours, so a token expiring more than (24 h − window) from now was sent within the window. */
export async function checkMagicLinkGate({ email }: { email: string }): Promise<SignInGate> {
	const recentExpiry = new Date(Date.now() + (LINK_LIFETIME_MINUTES - WINDOW_MINUTES) * 60_000);
	const [row] = await db
		.select({ count: sql<number>`count(*)::int` })
		.from(verificationToken)
		.where(and(eq(verificationToken.identifier, email.toLowerCase()), gt(verificationToken.expires, recentExpiry)));
	return (row?.count ?? 0) >= MAX_LINKS_PER_WINDOW
		? { blocked: true, retryAfterMinutes: WINDOW_MINUTES }
		: { blocked: false };
}
