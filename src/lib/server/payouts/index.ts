import { eq, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import * as audit from '../audit';
import { publicOrigin } from '../auth/origin';
import type { Executor } from '../db';
import { tailorProfile, type PayoutStatus } from '../db/schema';
import { isProcessorOutage, payments } from '../services/payments';

export type { PayoutStatus } from '../db/schema';

/** Who sets up payouts: the signed-in tailor, with the request's address for the audit log. */
export type PayoutActor = { id: string; email: string; ip?: string | null };

export type PayoutState = { status: PayoutStatus; accountId: string | null };

export class PayoutError extends Error {
	constructor(
		readonly code: 'not_found' | 'unavailable',
		message: string
	) {
		super(message);
	}
}

/** The workroom page that onboarding returns to (and that a used or expired link is sent back to). */
export const payoutsPath = '/workroom/payouts';

/** What the processor says about a connected account, in our four words. */
export function statusOf(
	account: Pick<Stripe.Account, 'payouts_enabled' | 'details_submitted' | 'requirements'>
): PayoutStatus {
	if (account.payouts_enabled) return 'enabled';
	const disabled = account.requirements?.disabled_reason;
	if (account.details_submitted && disabled && !disabled.startsWith('requirements.')) return 'restricted';
	if (account.details_submitted && (account.requirements?.past_due?.length ?? 0) > 0) return 'restricted';
	return 'pending';
}

/** The tailor's payout state, or null when they have no workroom. */
export async function stateOf(db: Executor, tailorId: string): Promise<PayoutState | null> {
	const [row] = await db
		.select({ status: tailorProfile.payoutStatus, accountId: tailorProfile.payoutAccountId })
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, tailorId))
		.limit(1);
	return row ?? null;
}

/** Whether the tailor can be paid: their connected account has finished onboarding and takes payouts. */
export async function ready(db: Executor, tailorId: string): Promise<boolean> {
	return (await stateOf(db, tailorId))?.status === 'enabled';
}

/** `ready` as a column of the tailor's workroom row, for a caller reading that row anyway. */
export const readyColumn = sql<boolean>`(${tailorProfile.payoutStatus} = 'enabled')`;

/** The connected account of a ready tailor (for transfers), or null when they cannot be paid yet. */
export async function destinationOf(db: Executor, tailorId: string): Promise<string | null> {
	const state = await stateOf(db, tailorId);
	return state?.status === 'enabled' ? state.accountId : null;
}

/**
 * Starts (or continues) payout onboarding: creates the tailor's Express connected account once — the
 * idempotency key `account:<tailor id>` makes a double click or a retry the same account — stores its id with
 * the status `pending`, and returns a fresh onboarding link whose return and refresh URLs lead back to the
 * workroom's payouts page.
 */
export async function startOnboarding(db: Executor, tailor: PayoutActor): Promise<{ url: string }> {
	try {
		return await onboard(db, tailor);
	} catch (error) {
		if (isProcessorOutage(error))
			throw new PayoutError(
				'unavailable',
				'The payment service is not answering just now. Please try again in a minute.'
			);
		throw error;
	}
}

async function onboard(db: Executor, tailor: PayoutActor): Promise<{ url: string }> {
	const [profile] = await db
		.select({
			accountId: tailorProfile.payoutAccountId,
			status: tailorProfile.payoutStatus,
			countryCode: tailorProfile.countryCode,
			shopName: tailorProfile.shopName
		})
		.from(tailorProfile)
		.where(eq(tailorProfile.userId, tailor.id))
		.limit(1);
	if (!profile) throw new PayoutError('not_found', 'Set up your workroom first; payouts belong to a workroom.');
	const stripe = payments();
	let accountId = profile.accountId;
	if (!accountId) {
		const account = await stripe.accounts.create(
			{
				type: 'express',
				country: profile.countryCode ?? undefined,
				email: tailor.email,
				capabilities: { transfers: { requested: true } },
				business_profile: { name: profile.shopName },
				metadata: { tailor_id: tailor.id }
			},
			{ idempotencyKey: `account:${tailor.id}` }
		);
		accountId = account.id;
		await db.transaction(async (tx) => {
			await tx
				.update(tailorProfile)
				.set({ payoutAccountId: accountId, payoutStatus: statusOf(account) })
				.where(eq(tailorProfile.userId, tailor.id));
			await audit.record(tx, {
				actorId: tailor.id,
				ip: tailor.ip,
				action: 'payouts.account_created',
				subjectType: 'tailor_profile',
				subjectId: tailor.id,
				data: { accountId }
			});
		});
	}
	const back = `${publicOrigin()}${payoutsPath}`;
	const link = await stripe.accountLinks.create({
		account: accountId,
		type: 'account_onboarding',
		return_url: `${back}?returned=1`,
		refresh_url: `${back}?refresh=1`
	});
	return { url: link.url };
}

/**
 * Follows the processor's word on a connected account (`account.updated`, or a read on return from
 * onboarding): stores its status for the tailor it belongs to. Unknown accounts are ignored; returns the
 * new status, or null.
 */
export async function applyAccountUpdate(
	db: Executor,
	account: Pick<Stripe.Account, 'id' | 'payouts_enabled' | 'details_submitted' | 'requirements'>
): Promise<PayoutStatus | null> {
	const status = statusOf(account);
	return db.transaction(async (tx) => {
		const [before] = await tx
			.select({ userId: tailorProfile.userId, status: tailorProfile.payoutStatus })
			.from(tailorProfile)
			.where(eq(tailorProfile.payoutAccountId, account.id))
			.for('update');
		if (!before) return null;
		if (before.status === status) return status;
		await tx.update(tailorProfile).set({ payoutStatus: status }).where(eq(tailorProfile.userId, before.userId));
		await audit.record(tx, {
			actorId: null,
			action: 'payouts.status_changed',
			subjectType: 'tailor_profile',
			subjectId: before.userId,
			data: { accountId: account.id, from: before.status, to: status }
		});
		return status;
	});
}

/** Re-reads the tailor's connected account from the processor (on return from onboarding) and applies it. */
export async function refresh(db: Executor, tailorId: string): Promise<PayoutState | null> {
	const state = await stateOf(db, tailorId);
	if (!state?.accountId) return state;
	const account = await payments().accounts.retrieve(state.accountId);
	const status = (await applyAccountUpdate(db, account)) ?? state.status;
	return { status, accountId: state.accountId };
}
