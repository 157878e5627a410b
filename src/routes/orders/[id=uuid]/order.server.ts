import * as accounts from '$lib/server/accounts';
import * as commissions from '$lib/server/commissions';
import * as fittings from '$lib/server/fittings';
import * as messages from '$lib/server/messages';
import * as orders from '$lib/server/orders';
import * as orderPage from '$lib/server/orders/page';
import * as payments from '$lib/server/payments';
import { labelsOf } from '$lib/server/workrooms/names';
import { statusLine } from '$lib/orders/status';
import type { SessionUser } from '$lib/types/user';
import { awardedDraftForPage, type DraftPage } from '../../commissions/[id=uuid]/draft.server';

type Db = App.Locals['db'];

/**
 * Everything the order page shows, for its customer, its tailor or an admin; null for anyone else (the same as
 * for a missing order). Each area answers for its own part: the order and its progress, the money and the
 * payments, the history, the workroom, the conversation, and — for the tailor — the measurements and draft.
 */
export async function orderPageData(
	db: Db,
	{ orderId, user, page }: { orderId: string; user: SessionUser; page: DraftPage }
) {
	const found = await orderPage.orderForViewer(db, { orderId, viewer: user });
	if (!found) return null;
	const { detail: order, audience } = found;
	const [view, money, steps, paymentRows, workrooms, threadId, profile, fittingsSummary, cancelRequest] =
		await Promise.all([
			commissions.getForViewer(db, { id: order.commissionId, viewer: user, unit: user.units }),
			payments.orderView(db, { orderId, viewer: user }),
			orderPage.progressSteps(db, orderId),
			payments.paymentHistory(db, orderId),
			labelsOf(db, [order.tailorId]),
			messages.threadIdFor(db, { commissionId: order.commissionId, tailorId: order.tailorId }),
			accounts.getProfile(db, { id: user.id }),
			fittings.summaryFor(db, { orderId, actor: user }),
			order.status === 'funded' ? orders.openCancellationRequest(db, orderId) : null
		]);
	const awarded = audience === 'tailor' && view?.viewer === 'awarded' ? view : null;
	const draft = awarded ? awardedDraftForPage(page, awarded.garment, awarded.measurements) : null;
	const workroom = workrooms.get(order.tailorId) ?? null;
	const customerName = audience === 'customer' ? 'You' : (view?.customer.name ?? 'The customer');
	// Who did what, as this viewer may read it; anyone else (an admin, a job) is Tackline.
	const changes = await orderPage.statusChanges(db, orderId, (actorId) => {
		if (actorId === user.id) return 'You';
		if (actorId === order.customerId) return customerName;
		if (actorId === order.tailorId) return workroom?.name ?? 'The workroom';
		return 'Tackline';
	});
	return {
		order,
		audience,
		money: money.money,
		lastPaymentFailure: money.lastPaymentFailure,
		commission: view && {
			id: view.id,
			title: view.title,
			garment: view.garment,
			garmentOther: view.garmentOther,
			handover: view.handover,
			customerName: view.customer.name
		},
		workroom,
		// A conversation is only for the two parties; an admin reads the order, not their messages.
		threadId: audience === 'admin' ? null : threadId,
		timeZone: profile?.timeZone ?? 'UTC',
		fittings: fittingsSummary,
		steps,
		rateText: orders.rateText(order.platformFeeBasisPoints),
		// A cancellation one side asked for and the other has not answered.
		cancelAskedBy: cancelRequest ? (cancelRequest.by === audience ? ('you' as const) : ('other' as const)) : null,
		timeline: orderPage.buildTimeline(
			{ steps, payments: paymentRows, changes: changes },
			(change) => statusLine(change.action) !== null
		),
		measurements: awarded?.measurements ?? null,
		draft
	};
}

export type OrderPageData = NonNullable<Awaited<ReturnType<typeof orderPageData>>>;
