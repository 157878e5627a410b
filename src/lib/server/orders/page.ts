import { and, asc, eq } from 'drizzle-orm';
import type {
	OrderAudience,
	OrderDetail,
	PaymentHistoryItem,
	ProgressStepView,
	StatusChange,
	TimelineItem
} from '$lib/types/order-page';
import type { PhotoVariant } from '$lib/types/photos';
import * as audit from '../audit';
import type { Executor } from '../db';
import { order, progressStep } from '../db/schema';
import { openVariant } from '../photos';

export type Viewer = { id: string; role: string };

const detailColumns = {
	id: order.id,
	commissionId: order.commissionId,
	customerId: order.customerId,
	tailorId: order.tailorId,
	status: order.status,
	priceMinor: order.priceMinor,
	platformFeeMinor: order.platformFeeMinor,
	tailorPayoutMinor: order.tailorPayoutMinor,
	platformFeeBasisPoints: order.platformFeeBasisPoints,
	advanceMinor: order.advanceMinor,
	currency: order.currency,
	dueDate: order.dueDate,
	createdAt: order.createdAt,
	fundedAt: order.fundedAt,
	workStartedAt: order.workStartedAt,
	readyAt: order.readyAt,
	deliveredAt: order.deliveredAt,
	autoReleaseAt: order.autoReleaseAt,
	releaseRequestedAt: order.releaseRequestedAt,
	releasedAt: order.releasedAt,
	refundRequestedAt: order.refundRequestedAt,
	cancelledAt: order.cancelledAt,
	cancelReason: order.cancelReason,
	fabricApprovedAt: order.fabricApprovedAt,
	deliveryMethod: order.deliveryMethod,
	trackingReference: order.trackingReference,
	deliveryNote: order.deliveryNote,
	alterationRequestedAt: order.alterationRequestedAt,
	alterationNote: order.alterationNote
};

const iso = (at: Date | null) => at?.toISOString() ?? null;

/** Whether the viewer may see the order at all: its customer, its tailor, or an admin. */
export function audienceOf(row: { customerId: string; tailorId: string }, viewer: Viewer): OrderAudience | null {
	if (row.customerId === viewer.id) return 'customer';
	if (row.tailorId === viewer.id) return 'tailor';
	return viewer.role === 'admin' ? 'admin' : null;
}

/**
 * The order as its page shows it, for its customer, its tailor or an admin; null for anyone else, exactly as
 * for an order that does not exist.
 */
export async function orderForViewer(
	db: Executor,
	{ orderId, viewer }: { orderId: string; viewer: Viewer }
): Promise<{ detail: OrderDetail; audience: OrderAudience } | null> {
	const [row] = await db.select(detailColumns).from(order).where(eq(order.id, orderId)).limit(1);
	if (!row) return null;
	const audience = audienceOf(row, viewer);
	if (!audience) return null;
	const { deliveryMethod, trackingReference, deliveryNote, alterationRequestedAt, alterationNote, createdAt, ...rest } =
		row;
	const detail: OrderDetail = {
		...rest,
		createdAt: createdAt.toISOString(),
		fundedAt: iso(row.fundedAt),
		workStartedAt: iso(row.workStartedAt),
		readyAt: iso(row.readyAt),
		deliveredAt: iso(row.deliveredAt),
		autoReleaseAt: iso(row.autoReleaseAt),
		releaseRequestedAt: iso(row.releaseRequestedAt),
		releasedAt: iso(row.releasedAt),
		refundRequestedAt: iso(row.refundRequestedAt),
		cancelledAt: iso(row.cancelledAt),
		fabricApprovedAt: iso(row.fabricApprovedAt),
		delivery: deliveryMethod ? { method: deliveryMethod, trackingReference, note: deliveryNote } : null,
		alteration: alterationRequestedAt
			? { requestedAt: alterationRequestedAt.toISOString(), note: alterationNote }
			: null
	};
	return { detail, audience };
}

/** Where a progress photo is served: through the order, so only its parties and admins get it. */
export function progressPhotoUrl(orderId: string, stepId: string, variant: PhotoVariant) {
	return `/orders/${orderId}/progress/${stepId}/${variant}`;
}

/** The tailor's progress steps, oldest first, with their photos' addresses. Callers check who is asking. */
export async function progressSteps(db: Executor, orderId: string): Promise<ProgressStepView[]> {
	const rows = await db
		.select({
			id: progressStep.id,
			kind: progressStep.kind,
			note: progressStep.note,
			recordedAt: progressStep.recordedAt,
			photoKey: progressStep.photoKey,
			width: progressStep.photoWidth,
			height: progressStep.photoHeight,
			altText: progressStep.photoAlt
		})
		.from(progressStep)
		.where(eq(progressStep.orderId, orderId))
		.orderBy(asc(progressStep.recordedAt), asc(progressStep.id))
		.limit(200);
	return rows.map((row) => ({
		id: row.id,
		kind: row.kind,
		note: row.note,
		recordedAt: row.recordedAt.toISOString(),
		photo: row.photoKey
			? {
					url: progressPhotoUrl(orderId, row.id, 'full'),
					thumbUrl: progressPhotoUrl(orderId, row.id, 'thumb'),
					width: row.width ?? 0,
					height: row.height ?? 0,
					altText: row.altText
				}
			: null
	}));
}

/**
 * What happened to the order as its audit history has it, oldest first. `nameOf` says who did it as the viewer
 * may read it (a workroom's name, "Wenna P.", "You"): the history's names and addresses stay on the server.
 */
export async function statusChanges(
	db: Executor,
	orderId: string,
	nameOf: (actorId: string | null) => string | null
): Promise<StatusChange[]> {
	const history = await audit.historyFor(db, { subjectType: 'order', subjectId: orderId, limit: 200 });
	return history.reverse().map((entry) => ({
		id: entry.id,
		action: entry.action,
		at: entry.at.toISOString(),
		by: nameOf(entry.actor?.id ?? null),
		reason: entry.reason
	}));
}

/**
 * The order's timeline, oldest first: progress steps, payments and status changes in one list. Changes that
 * another entry already tells (a payment, a progress post) are left out by `keepChange`.
 */
export function buildTimeline(
	{ steps, payments, changes }: { steps: ProgressStepView[]; payments: PaymentHistoryItem[]; changes: StatusChange[] },
	keepChange: (change: StatusChange) => boolean = () => true
): TimelineItem[] {
	const items: TimelineItem[] = [
		...steps.map((step) => ({ type: 'progress' as const, id: step.id, at: step.recordedAt, step })),
		...payments.map((payment) => ({ type: 'payment' as const, id: payment.id, at: payment.at, payment })),
		...changes.filter(keepChange).map((change) => ({ type: 'status' as const, id: change.id, at: change.at, change }))
	];
	// Same instant: the status change first (it caused the rest), then payments, then progress.
	const rank = { status: 0, payment: 1, progress: 2 };
	return items.sort((a, b) => a.at.localeCompare(b.at) || rank[a.type] - rank[b.type] || a.id.localeCompare(b.id));
}

/**
 * A progress photo for a same-origin route, after checking that the viewer is the order's customer, its
 * tailor or an admin. Null when it does not exist or the viewer may not see it.
 */
export async function openProgressPhoto(
	db: Executor,
	{ orderId, stepId, variant, viewer }: { orderId: string; stepId: string; variant: PhotoVariant; viewer: Viewer }
) {
	const [row] = await db
		.select({
			key: progressStep.photoKey,
			thumbKey: progressStep.photoThumbKey,
			customerId: order.customerId,
			tailorId: order.tailorId
		})
		.from(progressStep)
		.innerJoin(order, eq(order.id, progressStep.orderId))
		.where(and(eq(progressStep.id, stepId), eq(progressStep.orderId, orderId)))
		.limit(1);
	if (!row?.key || !audienceOf(row, viewer)) return null;
	return openVariant({ key: row.key, thumbKey: row.thumbKey }, variant);
}
