import { and, eq, gt, sql } from 'drizzle-orm';
import { getTemplate, sizeBand, type GarmentId } from '$lib/drafting';
import * as accounts from '../accounts';
import * as audit from '../audit';
import type { Executor } from '../db';
import { commission, commissionMeasurements, commissionSizeBand, type Commission } from '../db/schema';
import * as mail from '../mail';
import type { Mail } from '../mail';
import { noteCommissionChanged } from '../search-outbox';
import { commissionOpenDays } from '../services/commission-settings';
import { CommissionError, type CommissionIssue } from './errors';
import { coarsen } from '$lib/geo/coarsen';
import { cancelledMail, changedMail, describeChanges, expiredMail } from './mails';
import { snapshotFor } from './profile-snapshot';
import { liveQuoteTailors, hasAcceptedQuote, sizeBandOf } from './quotes-read';
import type { DraftChanges } from './schemas';
import { missingForPublish } from './completeness';
import { todayIn } from './lead-times';

/** Who acts: the signed-in person (routes pass `locals.user`), with the request's address for the audit log. */
export type Actor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

type Columns = Partial<typeof commission.$inferInsert>;

function toColumns(changes: DraftChanges): Columns {
	const { place, ...given } = changes;
	// A named garment carries no free-text name.
	const rest = given.garmentType && given.garmentType !== 'other' ? { ...given, garmentOther: '' } : given;
	if (!place) return rest;
	const point = coarsen(place);
	return {
		...rest,
		approxLat: point.lat,
		approxLng: point.lng,
		city: place.city,
		district: place.district,
		countryCode: place.countryCode
	};
}

/** Checks a change set against itself and the row it lands on: dates ahead, budgets in order, own profile. */
async function validate(
	db: Executor,
	changes: DraftChanges,
	row: Columns,
	{ ownerId, today }: { ownerId: string; today: string }
) {
	const issues: CommissionIssue[] = [];
	if (changes.dateNeeded !== undefined && changes.dateNeeded <= today)
		issues.push({ path: 'dateNeeded', message: 'Choose a date after today.' });
	const min = changes.budgetMinMinor ?? row.budgetMinMinor;
	const max = changes.budgetMaxMinor ?? row.budgetMaxMinor;
	if (min != null && max != null && min > max)
		issues.push({ path: 'budget', message: 'The lowest amount must not be above the highest.' });
	if (changes.measurementProfileId && !(await snapshotFor(db, { profileId: changes.measurementProfileId, ownerId })))
		issues.push({ path: 'measurementProfileId', message: 'Choose one of your own measurement profiles.' });
	if (issues.length) throw new CommissionError('invalid', 'Some fields need another look.', issues);
}

/** Today's date where the customer is: a date needed must come after it. */
async function customerToday(db: Executor, actor: Actor, today?: string) {
	if (today) return today;
	const profile = await accounts.getProfile(db, { id: actor.id });
	return todayIn(profile?.timeZone ?? 'UTC');
}

function requireCustomer(actor: Actor) {
	if (actor.role !== 'customer') throw new CommissionError('forbidden', 'Only customers post commissions.');
}

/** The row, locked for this transaction, if the actor owns it; others are told it does not exist. */
async function lockOwn(tx: Executor, id: string, actor: Actor): Promise<Commission> {
	requireCustomer(actor);
	const [row] = await tx.select().from(commission).where(eq(commission.id, id)).for('update').limit(1);
	if (!row || row.customerId !== actor.id) throw new CommissionError('not_found', 'There is no such commission.');
	return row;
}

function wrongStatus(row: Commission, doing: string): never {
	throw new CommissionError('wrong_status', `A commission that is ${row.status} cannot be ${doing}.`);
}

/** The columns whose value would actually change. */
function changedColumns(row: Commission, columns: Columns): Columns {
	return Object.fromEntries(Object.entries(columns).filter(([key, value]) => row[key as keyof Commission] !== value));
}

/** Writes a change to a locked row and its audit event; the new row comes back. */
async function saveChange(
	tx: Executor,
	row: Commission,
	{ actor, set, action, data }: { actor: Actor; set: Columns; action: string; data: Record<string, unknown> }
) {
	const [updated] = await tx
		.update(commission)
		.set({ ...set, updatedAt: new Date() })
		.where(eq(commission.id, row.id))
		.returning();
	await audit.record(tx, {
		actorId: actor.id,
		ip: actor.ip,
		action,
		subjectType: 'commission',
		subjectId: row.id,
		data
	});
	return updated;
}

/** One mail to each tailor with a live quote on the commission. */
async function mailQuotingTailors(tx: Executor, commissionId: string, write: (to: string) => Mail) {
	for (const { tailorId } of await liveQuoteTailors(tx, commissionId)) {
		const tailor = await accounts.getProfile(tx, { id: tailorId });
		if (tailor) await mail.queue(tx, write(tailor.email));
	}
}

/**
 * Starts a draft. A retry of the same request (same garment and title within a minute) returns the draft
 * the first attempt made instead of a second one.
 */
export async function createDraft(
	db: Executor,
	{
		actor,
		changes,
		today
	}: { actor: Actor; changes: DraftChanges & Required<Pick<DraftChanges, 'garmentType' | 'title'>>; today?: string }
) {
	requireCustomer(actor);
	return db.transaction(async (tx) => {
		await validate(tx, changes, {}, { ownerId: actor.id, today: await customerToday(tx, actor, today) });
		await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${'commission-draft:' + actor.id}))`);
		const [recent] = await tx
			.select()
			.from(commission)
			.where(
				and(
					eq(commission.customerId, actor.id),
					eq(commission.status, 'draft'),
					eq(commission.title, changes.title),
					eq(commission.garmentType, changes.garmentType),
					gt(commission.createdAt, sql`now() - interval '1 minute'`)
				)
			)
			.limit(1);
		if (recent) return recent;
		const [row] = await tx
			.insert(commission)
			.values({
				currency: 'EUR',
				...toColumns(changes),
				garmentType: changes.garmentType,
				title: changes.title,
				customerId: actor.id,
				status: 'draft'
			})
			.returning();
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'commission.drafted',
			subjectType: 'commission',
			subjectId: row.id
		});
		return row;
	});
}

/** Saves a step of a draft; saving the same values again changes nothing. */
export async function updateDraft(
	db: Executor,
	{ id, actor, changes, today }: { id: string; actor: Actor; changes: DraftChanges; today?: string }
) {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		if (row.status !== 'draft') wrongStatus(row, 'edited as a draft');
		await validate(tx, changes, row, { ownerId: actor.id, today: await customerToday(tx, actor, today) });
		const set = changedColumns(row, toColumns(changes));
		if (Object.keys(set).length === 0) return row;
		const updated = await saveChange(tx, row, {
			actor,
			set,
			action: 'commission.draft_saved',
			data: { fields: Object.keys(set) }
		});
		return updated;
	});
}

/**
 * Draft → open: freezes the chosen profile into `commission_measurements`, stores the size band the
 * quoting tailors see, and sets the publication and expiry times. Publishing an open one again is a no-op.
 */
export async function publish(
	db: Executor,
	{
		id,
		actor,
		today,
		now = new Date(),
		openDays = commissionOpenDays()
	}: { id: string; actor: Actor; today?: string; now?: Date; openDays?: number }
) {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		if (row.status === 'open') return { commission: row, sizeBand: await sizeBandOf(tx, id) };
		if (row.status !== 'draft') wrongStatus(row, 'published');
		const profile = row.measurementProfileId
			? await snapshotFor(tx, { profileId: row.measurementProfileId, ownerId: actor.id })
			: null;
		const missing = missingForPublish(row, profile, await customerToday(tx, actor, today));
		if (missing.length) throw new CommissionError('incomplete', 'The commission is not ready to publish yet.', missing);

		await tx
			.insert(commissionMeasurements)
			.values({ commissionId: id, ...profile! })
			.onConflictDoNothing();
		const band =
			row.garmentType === 'other'
				? null
				: sizeBand(profile!.valuesMm, getTemplate(row.garmentType as GarmentId).category);
		const bandRows = (band?.dimensions ?? []).map((d, i) => ({
			commissionId: id,
			dimension: d.code,
			position: i + 1,
			lowerMm: Math.round(d.minCm * 10),
			upperMm: Math.round(d.maxCm * 10)
		}));
		if (bandRows.length) await tx.insert(commissionSizeBand).values(bandRows).onConflictDoNothing();
		const expiresAt = new Date(now.getTime() + openDays * 86_400_000);
		const [updated] = await tx
			.update(commission)
			.set({ status: 'open', publishedAt: now, expiresAt, updatedAt: now })
			.where(eq(commission.id, id))
			.returning();
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'commission.published',
			subjectType: 'commission',
			subjectId: id,
			data: { expiresAt: expiresAt.toISOString() }
		});
		await noteCommissionChanged(tx, id);
		return {
			commission: updated,
			sizeBand: bandRows.map(({ dimension, lowerMm, upperMm }) => ({ dimension, lowerMm, upperMm }))
		};
	});
}

/** What may change once tailors can see the commission: not the garment or the measurements they price from. */
const lockedWhileOpen = ['garmentType', 'garmentOther', 'measurementProfileId'] as const;

/**
 * Edits an open commission. Each tailor with a live quote gets one mail listing what changed; sending the
 * same values again changes nothing and mails no one.
 */
export async function editOpen(
	db: Executor,
	{ id, actor, changes, today }: { id: string; actor: Actor; changes: DraftChanges; today?: string }
) {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		if (row.status !== 'open') wrongStatus(row, 'edited');
		const locked = lockedWhileOpen.filter((field) => changes[field] !== undefined && changes[field] !== row[field]);
		if (locked.length)
			throw new CommissionError(
				'invalid',
				'The garment and the measurements are fixed once a commission is open; cancel it and post a new one to change them.',
				locked.map((path) => ({ path, message: 'Fixed once the commission is open.' }))
			);
		await validate(tx, changes, row, { ownerId: actor.id, today: await customerToday(tx, actor, today) });
		const set = changedColumns(row, toColumns(changes));
		if (Object.keys(set).length === 0) return row;
		const updated = await saveChange(tx, row, {
			actor,
			set,
			action: 'commission.edited',
			data: { fields: Object.keys(set) }
		});
		await noteCommissionChanged(tx, id);
		const lines = describeChanges(row, updated);
		if (lines.length) await mailQuotingTailors(tx, id, (to) => changedMail(to, updated, lines));
		return updated;
	});
}

/** Draft or open → cancelled; tailors with a live quote are told. Cancelling again is a no-op. */
export async function cancel(db: Executor, { id, actor }: { id: string; actor: Actor }) {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		if (row.status === 'cancelled') return row;
		if (row.status !== 'draft' && row.status !== 'open') wrongStatus(row, 'cancelled');
		const updated = await saveChange(tx, row, {
			actor,
			set: { status: 'cancelled' },
			action: 'commission.cancelled',
			data: { from: row.status }
		});
		if (row.status === 'open') {
			await noteCommissionChanged(tx, id);
			await mailQuotingTailors(tx, id, (to) => cancelledMail(to, row));
		}
		return updated;
	});
}

/**
 * Open → expired once `expires_at` has passed with no accepted quote; the customer is told. Anything
 * else (already expired, awarded, extended) is left alone, so running it twice is harmless.
 */
export async function expire(db: Executor, { id, now = new Date() }: { id: string; now?: Date }) {
	return db.transaction(async (tx) => {
		const [row] = await tx.select().from(commission).where(eq(commission.id, id)).for('update').limit(1);
		if (!row || row.status !== 'open' || !row.expiresAt || row.expiresAt > now) return false;
		if (await hasAcceptedQuote(tx, id)) return false;
		await tx.update(commission).set({ status: 'expired', updatedAt: now }).where(eq(commission.id, id));
		await audit.record(tx, { actorId: null, action: 'commission.expired', subjectType: 'commission', subjectId: id });
		await noteCommissionChanged(tx, id);
		const customer = await accounts.getProfile(tx, { id: row.customerId });
		if (customer) await mail.queue(tx, expiredMail(customer.email, customer.name, row));
		return true;
	});
}

/** The least time a re-opened commission stays open, so the customer can still choose among the quotes. */
const reopenGraceMs = 7 * 86_400_000;

/**
 * Awarded → open again, when the order an acceptance made was cancelled before payment: the customer can
 * accept another quote. Its expiry is kept, or moved to a week from now when it would come sooner. Called
 * inside the cancellation's transaction; a commission that is not awarded is left as it is.
 */
export async function reopenAfterCancelledOrder(
	tx: Executor,
	{ id, orderId, actor, now = new Date() }: { id: string; orderId: string; actor: Pick<Actor, 'id' | 'ip'>; now?: Date }
): Promise<boolean> {
	const [row] = await tx.select().from(commission).where(eq(commission.id, id)).for('update').limit(1);
	if (!row || row.status !== 'awarded') return false;
	const floor = new Date(now.getTime() + reopenGraceMs);
	const expiresAt = row.expiresAt && row.expiresAt > floor ? row.expiresAt : floor;
	await tx.update(commission).set({ status: 'open', expiresAt, updatedAt: now }).where(eq(commission.id, id));
	await audit.record(tx, {
		actorId: actor.id,
		ip: actor.ip,
		action: 'commission.reopened',
		subjectType: 'commission',
		subjectId: id,
		data: { orderId, expiresAt: expiresAt.toISOString() }
	});
	await noteCommissionChanged(tx, id);
	return true;
}
