import { and, desc, eq, ilike, lt, or, sql, type SQL } from 'drizzle-orm';
import { db, type Executor } from '../db';
import { user, type LengthUnit, type UserRole } from '../db/schema';
import * as mail from '../mail';
import { hashPassword, verifyPassword } from '../auth/password';
import * as audit from '../audit';
import type { SessionUser } from '$lib/types/user';

const sessionColumns = {
	id: user.id,
	name: user.name,
	email: user.email,
	role: user.role,
	units: user.units,
	suspendedAt: user.suspendedAt
};

export async function getSessionUser({ id }: { id: string }, tx: Executor = db) {
	const [row] = await tx.select(sessionColumns).from(user).where(eq(user.id, id)).limit(1);
	if (!row) return null;
	const { suspendedAt, ...rest } = row;
	return { user: rest satisfies SessionUser, suspended: suspendedAt !== null };
}

export async function findByEmail({ email }: { email: string }, tx: Executor = db) {
	const [row] = await tx
		.select({ ...sessionColumns, passwordHash: user.passwordHash })
		.from(user)
		.where(sql`lower(${user.email}) = ${email.toLowerCase()}`)
		.limit(1);
	return row ?? null;
}

export class EmailTaken extends Error {
	constructor() {
		super('An account with this email address already exists.');
	}
}

export async function register(input: {
	name: string;
	email: string;
	password: string;
	role: UserRole;
	timeZone?: string;
}) {
	const passwordHash = await hashPassword(input.password);
	return db.transaction(async (tx) => {
		if (await findByEmail({ email: input.email }, tx)) throw new EmailTaken();
		const [created] = await tx
			.insert(user)
			.values({
				name: input.name,
				email: input.email.toLowerCase(),
				passwordHash,
				role: input.role,
				timeZone: input.timeZone
			})
			.onConflictDoNothing({ target: user.email })
			.returning({ id: user.id, role: user.role });
		if (!created) throw new EmailTaken();
		await audit.record(tx, {
			actorId: created.id,
			action: 'account.registered',
			subjectType: 'user',
			subjectId: created.id,
			data: { role: input.role }
		});
		return created;
	});
}

export type CredentialCheck =
	| { ok: true; user: { id: string; email: string; name: string | null; role: UserRole } }
	| { ok: false; reason: 'invalid' | 'suspended' };

/** Suspension is revealed only to someone who knows the password. */
export async function verifyCredentials({
	email,
	password
}: {
	email: string;
	password: string;
}): Promise<CredentialCheck> {
	const found = await findByEmail({ email });
	if (!found?.passwordHash || !(await verifyPassword(found.passwordHash, password))) {
		return { ok: false, reason: 'invalid' };
	}
	if (found.suspendedAt) return { ok: false, reason: 'suspended' };
	return { ok: true, user: { id: found.id, email: found.email, name: found.name, role: found.role } };
}

export async function suspend({ userId, reason, actorId }: { userId: string; reason: string; actorId: string | null }) {
	await db.transaction(async (tx) => {
		const [changed] = await tx
			.update(user)
			.set({ suspendedAt: new Date(), suspendedReason: reason })
			.where(sql`${user.id} = ${userId} and ${user.suspendedAt} is null`)
			.returning({ id: user.id });
		if (changed)
			await audit.record(tx, {
				actorId,
				action: 'account.suspended',
				subjectType: 'user',
				subjectId: userId,
				data: { reason }
			});
	});
}

export async function reinstate({ userId, actorId }: { userId: string; actorId: string | null }) {
	await db.transaction(async (tx) => {
		const [changed] = await tx
			.update(user)
			.set({ suspendedAt: null, suspendedReason: null })
			.where(sql`${user.id} = ${userId} and ${user.suspendedAt} is not null`)
			.returning({ id: user.id });
		if (changed)
			await audit.record(tx, { actorId, action: 'account.reinstated', subjectType: 'user', subjectId: userId });
	});
}

export async function countByRole() {
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
export async function list({
	search,
	role,
	after,
	limit = 25
}: {
	search?: string;
	role?: UserRole;
	after?: { createdAt: Date; id: string };
	limit?: number;
}): Promise<{ users: UserListItem[]; next: { createdAt: Date; id: string } | null }> {
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

export async function getProfile({ id }: { id: string }) {
	const [row] = await db
		.select({
			name: user.name,
			email: user.email,
			units: user.units,
			timeZone: user.timeZone,
			hasPassword: sql<boolean>`${user.passwordHash} is not null`
		})
		.from(user)
		.where(eq(user.id, id))
		.limit(1);
	return row ?? null;
}

export async function updateProfile(input: { userId: string; name: string; units: LengthUnit; timeZone: string }) {
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
 * through an emailed link (which is how a forgotten password is replaced).
 */
export async function changePassword(input: {
	userId: string;
	currentPassword: string;
	newPassword: string;
	maySkipCurrent: boolean;
}) {
	const [row] = await db
		.select({ email: user.email, passwordHash: user.passwordHash })
		.from(user)
		.where(eq(user.id, input.userId));
	if (!row) throw new Error('account not found');
	if (row.passwordHash && !input.maySkipCurrent && !(await verifyPassword(row.passwordHash, input.currentPassword))) {
		throw new WrongPassword();
	}
	const passwordHash = await hashPassword(input.newPassword);
	await db.transaction(async (tx) => {
		await tx.update(user).set({ passwordHash }).where(eq(user.id, input.userId));
		await audit.record(tx, {
			actorId: input.userId,
			action: 'account.password_changed',
			subjectType: 'user',
			subjectId: input.userId
		});
	});
	await mail.send(mail.passwordChangedMail(row.email));
}
