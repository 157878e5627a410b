import { and, eq, lte, sql } from 'drizzle-orm';
import { advanceIssue } from '$lib/quotes/advance';
import * as accounts from '../accounts';
import * as audit from '../audit';
import { todayIn } from '../commissions';
import { commissionForQuoting, type CommissionForQuoting } from '../commissions/for-quoting';
import type { Executor } from '../db';
import { quote, type Quote } from '../db/schema';
import * as mail from '../mail';
import { openThread } from '../messages/threads';
import { notify } from '../notifications';
import { noteCommissionChanged } from '../search-outbox';
import * as workrooms from '../workrooms';
import { QuoteError, type QuoteIssue } from './errors';
import { quoteEditedMail, quoteLapsedMail, quoteSentNotice, quoteWithdrawnMail } from './mails';
import type { QuoteCreate, QuotePatch } from './schemas';
import { quoteWarnings, type QuoteWarning } from './warnings';

/** Who acts: the signed-in person (routes pass `locals.user`), with the request's address for the audit log. */
export type Actor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

/** The terms of a quote; no advance means none. */
type Terms = Omit<QuoteCreate, 'message' | 'advanceMinor'> & { message: string; advanceMinor?: number };
type Sent = { quote: Quote; warnings: QuoteWarning[] };

function requireTailor(actor: Actor) {
	if (actor.role !== 'tailor') throw new QuoteError('forbidden', 'Only tailors send quotes.');
}

/** Today's date where the tailor is: a delivery date must come after it. */
async function tailorToday(db: Executor, actor: Actor, today?: string) {
	if (today) return today;
	const profile = await accounts.getProfile(db, { id: actor.id });
	return todayIn(profile?.timeZone ?? 'UTC');
}

/** The checks that need the commission: its currency, today, and how long it stays open. */
function validate(terms: Terms, c: CommissionForQuoting, { today, now }: { today: string; now: Date }) {
	const issues: QuoteIssue[] = [];
	if (terms.currency !== c.currency)
		issues.push({ path: 'currency', message: `This commission is priced in ${c.currency}; quote in ${c.currency}.` });
	if (terms.deliveryDate <= today)
		issues.push({ path: 'deliveryDate', message: 'Choose a delivery date after today.' });
	const advance = advanceIssue({ ...terms, advanceMinor: terms.advanceMinor ?? 0 });
	if (advance) issues.push(advance);
	if (terms.validUntil <= now) issues.push({ path: 'validUntil', message: 'Choose a date in the future.' });
	else if (c.expiresAt && terms.validUntil > c.expiresAt)
		issues.push({
			path: 'validUntil',
			message: `The commission closes on ${c.expiresAt.toISOString().slice(0, 10)}; the quote cannot stay valid after that.`
		});
	if (issues.length) throw new QuoteError('invalid', 'Some fields need another look.', issues);
}

/** The open commission, share-locked for this transaction; drafts and unknown ids do not exist for tailors. */
async function openCommission(tx: Executor, commissionId: string, doing: string) {
	const c = await commissionForQuoting(tx, { id: commissionId, lock: true });
	if (!c || c.status === 'draft') throw new QuoteError('not_found', 'There is no such commission.');
	if (c.status !== 'open')
		throw new QuoteError('wrong_status', `This commission is ${c.status}, so quotes on it can no longer be ${doing}.`);
	return c;
}

/** The actor's own quote, locked; anyone else's is reported as not existing. */
async function lockOwn(tx: Executor, id: string, actor: Actor) {
	requireTailor(actor);
	const [row] = await tx.select().from(quote).where(eq(quote.id, id)).for('update').limit(1);
	if (!row || row.tailorId !== actor.id) throw new QuoteError('not_found', 'There is no such quote.');
	return row;
}

function requireSent(row: Quote, doing: string) {
	if (row.status !== 'sent')
		throw new QuoteError('wrong_status', `This quote is ${row.status}; only a quote still waiting can be ${doing}.`);
}

async function workroomName(db: Executor, tailorId: string) {
	return (await workrooms.getOwn(db, { tailorId }))?.name ?? 'A workroom';
}

async function mailCustomer(
	tx: Executor,
	c: CommissionForQuoting,
	write: (to: string, name: string | null) => mail.Mail
) {
	const customer = await accounts.getProfile(tx, { id: c.customerId });
	if (customer) await mail.queue(tx, write(customer.email, customer.name));
}

async function warningsOf(db: Executor, row: Quote, c: Pick<CommissionForQuoting, 'dateNeeded'>) {
	const workroom = await workrooms.getOwn(db, { tailorId: row.tailorId });
	return quoteWarnings(db, {
		tailorId: row.tailorId,
		deliveryDate: row.deliveryDate,
		dateNeeded: c.dateNeeded,
		capacity: workroom?.capacity ?? 1
	});
}

function isUniqueViolation(error: unknown): boolean {
	const seen = new Set<unknown>();
	for (let e = error; e && typeof e === 'object' && !seen.has(e); e = (e as { cause?: unknown }).cause) {
		seen.add(e);
		if ((e as { code?: unknown }).code === '23505') return true;
	}
	return false;
}

const duplicate = () =>
	new QuoteError('conflict', 'You already have a quote waiting on this commission: change it or withdraw it instead.');

/**
 * Sends a quote: the tailor's onboarding must be complete, the commission open, and the tailor without a
 * live quote on it. Opens the thread between the customer and the tailor, and tells the customer.
 */
export async function send(
	db: Executor,
	{
		commissionId,
		actor,
		terms,
		today,
		now = new Date()
	}: { commissionId: string; actor: Actor; terms: Terms; today?: string; now?: Date }
): Promise<Sent> {
	requireTailor(actor);
	if (!(await workrooms.canQuote(db, { tailorId: actor.id })))
		throw new QuoteError('forbidden', 'Finish setting up your workroom before you send quotes.');
	try {
		return await db.transaction(async (tx) => {
			const c = await openCommission(tx, commissionId, 'sent');
			validate(terms, c, { today: await tailorToday(tx, actor, today), now });
			await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`quote:${commissionId}:${actor.id}`}))`);
			const [live] = await tx
				.select({ id: quote.id })
				.from(quote)
				.where(
					and(
						eq(quote.commissionId, commissionId),
						eq(quote.tailorId, actor.id),
						sql`${quote.status} in ('sent', 'accepted')`
					)
				)
				.limit(1);
			if (live) throw duplicate();
			const [row] = await tx
				.insert(quote)
				.values({
					commissionId,
					tailorId: actor.id,
					priceMinor: terms.priceMinor,
					currency: terms.currency,
					deliveryDate: terms.deliveryDate,
					fittingsIncluded: terms.fittings,
					fabricIncluded: terms.fabricIncluded,
					message: terms.message,
					validUntil: terms.validUntil,
					advanceMinor: terms.advanceMinor ?? 0,
					status: 'sent'
				})
				.returning();
			await openThread(tx, { commissionId, tailorId: actor.id });
			await noteCommissionChanged(tx, commissionId);
			await audit.record(tx, {
				actorId: actor.id,
				ip: actor.ip,
				action: 'quote.sent',
				subjectType: 'quote',
				subjectId: row.id,
				data: { commissionId, priceMinor: row.priceMinor, advanceMinor: row.advanceMinor, currency: row.currency }
			});
			const workroom = await workroomName(tx, actor.id);
			await notify(tx, quoteSentNotice(c.customerId, c, workroom, row));
			return { quote: row, warnings: await warningsOf(tx, row, c) };
		});
	} catch (error) {
		if (isUniqueViolation(error)) throw duplicate();
		throw error;
	}
}

/** Changes a quote still waiting for an answer; the customer is told what it now says. */
export async function edit(
	db: Executor,
	{
		id,
		actor,
		changes,
		today,
		now = new Date()
	}: { id: string; actor: Actor; changes: QuotePatch; today?: string; now?: Date }
): Promise<Sent> {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		requireSent(row, 'changed');
		const c = await openCommission(tx, row.commissionId, 'changed');
		const merged: Terms = {
			priceMinor: changes.priceMinor ?? row.priceMinor,
			currency: changes.currency ?? row.currency,
			deliveryDate: changes.deliveryDate ?? row.deliveryDate,
			fittings: changes.fittings ?? row.fittingsIncluded,
			fabricIncluded: changes.fabricIncluded ?? row.fabricIncluded,
			message: changes.message ?? row.message,
			validUntil: changes.validUntil ?? row.validUntil,
			advanceMinor: changes.advanceMinor ?? row.advanceMinor
		};
		validate(merged, c, { today: await tailorToday(tx, actor, today), now });
		const set = {
			priceMinor: merged.priceMinor,
			currency: merged.currency,
			deliveryDate: merged.deliveryDate,
			fittingsIncluded: merged.fittings,
			fabricIncluded: merged.fabricIncluded,
			message: merged.message,
			validUntil: merged.validUntil,
			advanceMinor: merged.advanceMinor ?? 0
		};
		const changed = Object.entries(set)
			.filter(([key, value]) => {
				const before = row[key as keyof typeof set];
				return before instanceof Date && value instanceof Date
					? before.getTime() !== value.getTime()
					: before !== value;
			})
			.map(([key]) => key);
		if (changed.length === 0) return { quote: row, warnings: await warningsOf(tx, row, c) };
		const [updated] = await tx
			.update(quote)
			.set({ ...set, updatedAt: now })
			.where(eq(quote.id, id))
			.returning();
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'quote.edited',
			subjectType: 'quote',
			subjectId: id,
			data: { fields: changed }
		});
		const workroom = await workroomName(tx, actor.id);
		await mailCustomer(tx, c, (to, name) => quoteEditedMail(to, name, c, workroom, updated));
		return { quote: updated, warnings: await warningsOf(tx, updated, c) };
	});
}

/** Takes back a quote still waiting for an answer. Withdrawing it again changes nothing. */
export async function withdraw(
	db: Executor,
	{ id, actor, now = new Date() }: { id: string; actor: Actor; now?: Date }
) {
	return db.transaction(async (tx) => {
		const row = await lockOwn(tx, id, actor);
		if (row.status === 'withdrawn') return row;
		requireSent(row, 'withdrawn');
		const [updated] = await tx
			.update(quote)
			.set({ status: 'withdrawn', decidedAt: now, updatedAt: now })
			.where(eq(quote.id, id))
			.returning();
		await noteCommissionChanged(tx, row.commissionId);
		await audit.record(tx, {
			actorId: actor.id,
			ip: actor.ip,
			action: 'quote.withdrawn',
			subjectType: 'quote',
			subjectId: id,
			data: { commissionId: row.commissionId }
		});
		const c = await commissionForQuoting(tx, { id: row.commissionId });
		if (c?.status === 'open') {
			const workroom = await workroomName(tx, actor.id);
			await mailCustomer(tx, c, (to, name) => quoteWithdrawnMail(to, name, c, workroom));
		}
		return updated;
	});
}

/**
 * Sent → lapsed once `valid_until` has passed unanswered; the tailor is told. Anything else (answered,
 * withdrawn, extended, already lapsed) is left alone, so running it twice is harmless.
 */
export async function lapse(db: Executor, { id, now = new Date() }: { id: string; now?: Date }) {
	return db.transaction(async (tx) => {
		const [row] = await tx.select().from(quote).where(eq(quote.id, id)).for('update').limit(1);
		if (!row || row.status !== 'sent' || row.validUntil > now) return false;
		const [updated] = await tx
			.update(quote)
			.set({ status: 'lapsed', decidedAt: now, updatedAt: now })
			.where(eq(quote.id, id))
			.returning();
		await noteCommissionChanged(tx, row.commissionId);
		await audit.record(tx, { actorId: null, action: 'quote.lapsed', subjectType: 'quote', subjectId: id });
		const [c, tailor] = await Promise.all([
			commissionForQuoting(tx, { id: row.commissionId }),
			accounts.getProfile(tx, { id: row.tailorId })
		]);
		if (c && tailor) await mail.queue(tx, quoteLapsedMail(tailor.email, c, updated));
		return true;
	});
}

/**
 * The lapse job's worker: every sent quote past its `valid_until` lapses, each in its own transaction,
 * so one failure leaves the rest done and the next run picks up what is left.
 */
export async function lapseDue(db: Executor, { now = new Date(), limit = 200 }: { now?: Date; limit?: number } = {}) {
	const due = await db
		.select({ id: quote.id })
		.from(quote)
		.where(and(eq(quote.status, 'sent'), lte(quote.validUntil, now)))
		.orderBy(quote.validUntil)
		.limit(limit);
	let lapsed = 0;
	for (const { id } of due) if (await lapse(db, { id, now })) lapsed += 1;
	return lapsed;
}
