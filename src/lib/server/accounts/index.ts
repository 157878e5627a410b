import { and, desc, eq, gt, ilike, isNull, lt, or, sql, type SQL } from 'drizzle-orm';
import type { Executor } from '../db';
import { session, user, type LengthUnit, type UserRole } from '../db/schema';
import * as mail from '../mail';
import * as audit from '../audit';
import { dataVersionColumn } from '../freshness';
import { noteWorkroomChanged } from '../search-outbox';
import type { SessionUser } from '$lib/types/user';
import { hashPassword, verifyAgainstNothing, verifyPassword } from './password';
import { accountExistsMail, confirmAddressMail, noAccountMail, signInLinkMail, suspendedAccountMail } from './mails';
import { endSessionsOf } from './sessions';

export { endSession, startSession } from './sessions';

const sessionColumns = {
	id: user.id,
	name: user.name,
	email: user.email,
	role: user.role,
	units: user.units,
	suspendedAt: user.suspendedAt
};

/**
 * The user behind a session token, whether the account is suspended, whether the session is still live, and
 * the count of committed changes (freshness) as this statement saw it, before the request reads anything else.
 */
export async function getSessionUser(db: Executor, { id, sessionId }: { id: string; sessionId: string | undefined }) {
	const [row] = await db
		.select({
			...sessionColumns,
			live: sql<boolean>`${session.sessionToken} is not null`,
			dataVersion: dataVersionColumn()
		})
		.from(user)
		.leftJoin(
			session,
			and(eq(session.userId, user.id), eq(session.sessionToken, sessionId ?? ''), gt(session.expires, new Date()))
		)
		.where(eq(user.id, id))
		.limit(1);
	if (!row) return null;
	const { suspendedAt, live, dataVersion, ...rest } = row;
	return {
		user: rest satisfies SessionUser,
		suspended: suspendedAt !== null,
		live: Boolean(live),
		dataVersion: String(dataVersion)
	};
}

export async function findByEmail(db: Executor, { email }: { email: string }) {
	const [row] = await db
		.select({ ...sessionColumns, passwordHash: user.passwordHash, emailVerified: user.emailVerified })
		.from(user)
		.where(sql`lower(${user.email}) = ${email.toLowerCase()}`)
		.limit(1);
	return row ?? null;
}

/**
 * A taken address answers exactly like a free one: its owner is told by mail instead. The new
 * account signs in only once its address is confirmed through the link it is sent.
 */
export async function register(
	db: Executor,
	input: { name: string; email: string; password: string; role: UserRole; timeZone?: string },
	{ origin }: { origin: string }
): Promise<{ created: boolean }> {
	const passwordHash = await hashPassword(input.password);
	return db.transaction(async (tx) => {
		const [created] = await tx
			.insert(user)
			.values({
				name: input.name,
				email: input.email.toLowerCase(),
				passwordHash,
				role: input.role,
				timeZone: input.timeZone
			})
			.onConflictDoNothing()
			.returning({ id: user.id });
		if (!created) {
			await mail.queue(tx, accountExistsMail(input.email, origin));
			return { created: false };
		}
		await audit.record(tx, {
			actorId: created.id,
			action: 'account.registered',
			subjectType: 'user',
			subjectId: created.id,
			data: { role: input.role }
		});
		return { created: true };
	});
}

/**
 * Asked from the sign-in page for an address nobody has confirmed yet: whoever asks does not use the
 * password given at sign-up, so it is dropped. Otherwise someone who signed up first with another
 * person's address would hold a working password once the real owner confirms it through a link.
 * The same statement runs whether or not the address has an account.
 */
export async function forgetUnconfirmedPassword(db: Executor, { email }: { email: string }) {
	await db
		.update(user)
		.set({ passwordHash: null })
		.where(and(sql`lower(${user.email}) = ${email.toLowerCase()}`, isNull(user.emailVerified)));
}

/** Decides what a requested sign-in link mail says; the same amount of work whoever asked. */
export async function mailSignInLink(
	db: Executor,
	{ email, url, origin }: { email: string; url: string; origin: string }
) {
	const found = await findByEmail(db, { email });
	const message = !found
		? noAccountMail(email, origin)
		: found.suspendedAt
			? suspendedAccountMail(email)
			: found.emailVerified || !found.passwordHash
				? signInLinkMail(email, url)
				: confirmAddressMail(email, url);
	await mail.queue(db, message);
}

/** Whether an emailed link may sign this address in (the account exists and is not suspended). */
export async function linkSignInAllowed(db: Executor, { email }: { email: string }) {
	const found = await findByEmail(db, { email });
	if (!found) return 'unknown' as const;
	return found.suspendedAt ? ('suspended' as const) : ('allowed' as const);
}

export type CredentialCheck =
	| { ok: true; user: { id: string; email: string; name: string | null; role: UserRole } }
	| { ok: false; reason: 'invalid' | 'suspended' };

/**
 * Unknown addresses spend the same argon2 time as known ones. Suspension is revealed only to someone
 * who knows the password; an unconfirmed address cannot sign in with a password yet.
 */
export async function verifyCredentials(
	db: Executor,
	{ email, password }: { email: string; password: string }
): Promise<CredentialCheck> {
	const found = await findByEmail(db, { email });
	const matches = found?.passwordHash
		? await verifyPassword(found.passwordHash, password)
		: await verifyAgainstNothing(password);
	if (!found || !matches || !found.emailVerified) return { ok: false, reason: 'invalid' };
	if (found.suspendedAt) return { ok: false, reason: 'suspended' };
	return { ok: true, user: { id: found.id, email: found.email, name: found.name, role: found.role } };
}

export async function suspend(
	db: Executor,
	{ userId, reason, actorId }: { userId: string; reason: string; actorId: string | null }
) {
	await db.transaction(async (tx) => {
		const [changed] = await tx
			.update(user)
			.set({ suspendedAt: new Date(), suspendedReason: reason })
			.where(sql`${user.id} = ${userId} and ${user.suspendedAt} is null`)
			.returning({ id: user.id, role: user.role });
		if (!changed) return;
		// A suspended tailor's workroom leaves the search results.
		if (changed.role === 'tailor') await noteWorkroomChanged(tx, userId);
		// Reinstatement must not bring old cookies back to life.
		await endSessionsOf(tx, { userId });
		await audit.record(tx, {
			actorId,
			action: 'account.suspended',
			subjectType: 'user',
			subjectId: userId,
			data: { reason }
		});
	});
}

export async function reinstate(db: Executor, { userId, actorId }: { userId: string; actorId: string | null }) {
	await db.transaction(async (tx) => {
		const [changed] = await tx
			.update(user)
			.set({ suspendedAt: null, suspendedReason: null })
			.where(sql`${user.id} = ${userId} and ${user.suspendedAt} is not null`)
			.returning({ id: user.id, role: user.role });
		if (!changed) return;
		if (changed.role === 'tailor') await noteWorkroomChanged(tx, userId);
		await audit.record(tx, { actorId, action: 'account.reinstated', subjectType: 'user', subjectId: userId });
	});
}

/** Signs the user out everywhere (an admin's action, or a script's). */
export async function endAllSessions(db: Executor, { userId, actorId }: { userId: string; actorId: string | null }) {
	return db.transaction(async (tx) => {
		const ended = await endSessionsOf(tx, { userId });
		await audit.record(tx, {
			actorId,
			action: 'account.sessions_ended',
			subjectType: 'user',
			subjectId: userId,
			data: { ended }
		});
		return ended;
	});
}

export async function countByRole(db: Executor) {
	const rows = await db
		.select({ role: user.role, count: sql<number>`count(*)::int` })
		.from(user)
		.groupBy(user.role);
	const counts: Record<UserRole, number> = { customer: 0, tailor: 0, admin: 0 };
	for (const row of rows) counts[row.role] = row.count;
	return counts;
}

export type UserListItem = {
	id: string;
	name: string | null;
	email: string;
	role: UserRole;
	suspended: boolean;
	suspendedReason: string | null;
	createdAt: Date;
};

/** Newest first, with keyset paging on (created at, id): `after` is the last row of the previous page. */
export async function list(
	db: Executor,
	{
		search,
		role,
		after,
		limit = 25
	}: {
		search?: string;
		role?: UserRole;
		after?: { createdAt: Date; id: string };
		limit?: number;
	}
): Promise<{ users: UserListItem[]; next: { createdAt: Date; id: string } | null }> {
	const filters: SQL[] = [];
	if (search) {
		const pattern = `%${search.replace(/[\\%_]/g, (c) => '\\' + c)}%`;
		filters.push(or(ilike(user.email, pattern), ilike(user.name, pattern))!);
	}
	if (role) filters.push(eq(user.role, role));
	if (after) {
		filters.push(
			or(lt(user.createdAt, after.createdAt), and(eq(user.createdAt, after.createdAt), lt(user.id, after.id)))!
		);
	}
	const rows = await db
		.select({
			id: user.id,
			name: user.name,
			email: user.email,
			role: user.role,
			suspendedAt: user.suspendedAt,
			suspendedReason: user.suspendedReason,
			createdAt: user.createdAt
		})
		.from(user)
		.where(filters.length ? and(...filters) : undefined)
		.orderBy(desc(user.createdAt), desc(user.id))
		.limit(limit + 1);
	const page = rows.slice(0, limit).map(({ suspendedAt, ...row }) => ({ ...row, suspended: suspendedAt !== null }));
	const last = page.at(-1);
	return { users: page, next: rows.length > limit && last ? { createdAt: last.createdAt, id: last.id } : null };
}

export async function getProfile(db: Executor, { id }: { id: string }) {
	const [row] = await db
		.select({
			name: user.name,
			email: user.email,
			units: user.units,
			timeZone: user.timeZone,
			role: user.role,
			hasPassword: sql<boolean>`${user.passwordHash} is not null`
		})
		.from(user)
		.where(eq(user.id, id))
		.limit(1);
	return row ?? null;
}

export async function updateProfile(
	db: Executor,
	input: { userId: string; name: string; units: LengthUnit; timeZone: string }
) {
	await db
		.update(user)
		.set({ name: input.name, units: input.units, timeZone: input.timeZone })
		.where(eq(user.id, input.userId));
}

export class WrongPassword extends Error {
	constructor() {
		super('That is not your current password.');
	}
}

/**
 * Needs the current password, unless the account has none yet or the person has just signed in
 * through an emailed link (which is how a forgotten password is replaced). Every other session ends.
 */
export async function changePassword(
	db: Executor,
	input: {
		userId: string;
		currentPassword: string;
		newPassword: string;
		maySkipCurrent: boolean;
		keepSessionId: string | null;
	}
) {
	const [row] = await db
		.select({ email: user.email, passwordHash: user.passwordHash })
		.from(user)
		.where(eq(user.id, input.userId));
	if (!row) throw new Error('account not found');
	if (row.passwordHash && !input.maySkipCurrent && !(await verifyPassword(row.passwordHash, input.currentPassword))) {
		throw new WrongPassword();
	}
	const passwordHash = await hashPassword(input.newPassword);
	return db.transaction(async (tx) => {
		await tx.update(user).set({ passwordHash }).where(eq(user.id, input.userId));
		const endedSessions = await endSessionsOf(tx, { userId: input.userId, except: input.keepSessionId });
		await audit.record(tx, {
			actorId: input.userId,
			action: 'account.password_changed',
			subjectType: 'user',
			subjectId: input.userId,
			data: { endedSessions }
		});
		await mail.queue(tx, mail.passwordChangedMail(row.email));
		return { endedSessions };
	});
}

/** Makes (or promotes) an administrator with a confirmed address and the given password. */
export async function ensureAdmin(db: Executor, input: { email: string; name: string; password: string }) {
	const passwordHash = await hashPassword(input.password);
	const email = input.email.trim().toLowerCase();
	return db.transaction(async (tx) => {
		const [admin] = await tx
			.insert(user)
			.values({ email, name: input.name, role: 'admin', passwordHash, emailVerified: new Date() })
			.onConflictDoUpdate({
				target: user.email,
				set: {
					role: 'admin',
					passwordHash,
					suspendedAt: null,
					emailVerified: sql`coalesce(${user.emailVerified}, now())`
				}
			})
			.returning({ id: user.id });
		await endSessionsOf(tx, { userId: admin.id });
		await audit.record(tx, {
			actorId: null,
			action: 'account.made_admin',
			subjectType: 'user',
			subjectId: admin.id,
			data: { via: 'cli' }
		});
		return admin;
	});
}

/** Every administrator's id (active ones), for alerts that need a person. */
export async function adminIds(db: Executor): Promise<string[]> {
	const rows = await db
		.select({ id: user.id })
		.from(user)
		.where(and(eq(user.role, 'admin'), isNull(user.suspendedAt)));
	return rows.map((row) => row.id);
}
