import type { OrderStatus } from './order';

/** The steps a tailor reports, in the order they usually come. */
export const progressStepKinds = [
	'fabric_sourced',
	'pattern_drafted',
	'cutting',
	'first_fitting',
	'sewing',
	'final_fitting',
	'finishing',
	'ready'
] as const;
export type ProgressStepKind = (typeof progressStepKinds)[number];

export type DeliveryMethod = 'pickup' | 'courier';

/** A photo of an order's progress: same-origin addresses that let only the order's parties and admins in. */
export type ProgressPhoto = { url: string; thumbUrl: string; width: number; height: number; altText: string };

export type ProgressStepView = {
	id: string;
	kind: ProgressStepKind;
	note: string;
	recordedAt: string;
	photo: ProgressPhoto | null;
};

export type PaymentKind = 'charge' | 'advance_transfer' | 'release_transfer' | 'refund' | 'reversal';

/** One processor object of an order (a charge, a transfer, a refund) without its processor ids. */
export type PaymentHistoryItem = {
	id: string;
	kind: PaymentKind;
	amountMinor: number;
	currency: string;
	status: 'pending' | 'succeeded' | 'failed';
	failureReason: string | null;
	at: string;
};

/** A change of the order recorded in its audit history, with who made it (a name, never an address). */
export type StatusChange = { id: string; action: string; at: string; by: string | null; reason: string | null };

export type TimelineItem =
	| { type: 'progress'; id: string; at: string; step: ProgressStepView }
	| { type: 'payment'; id: string; at: string; payment: PaymentHistoryItem }
	| { type: 'status'; id: string; at: string; change: StatusChange };

/** The order's own facts as its page shows them. Instants are ISO strings. */
export type OrderDetail = {
	id: string;
	commissionId: string;
	customerId: string;
	tailorId: string;
	status: OrderStatus;
	priceMinor: number;
	platformFeeMinor: number;
	tailorPayoutMinor: number;
	platformFeeBasisPoints: number;
	advanceMinor: number;
	currency: string;
	dueDate: string;
	createdAt: string;
	fundedAt: string | null;
	workStartedAt: string | null;
	readyAt: string | null;
	deliveredAt: string | null;
	autoReleaseAt: string | null;
	releaseRequestedAt: string | null;
	releasedAt: string | null;
	refundRequestedAt: string | null;
	cancelledAt: string | null;
	cancelReason: string;
	fabricApprovedAt: string | null;
	delivery: { method: DeliveryMethod; trackingReference: string | null; note: string } | null;
	alteration: { requestedAt: string; note: string } | null;
};

/** Who is looking at an order page. */
export type OrderAudience = 'customer' | 'tailor' | 'admin';

/** One order on a list or the tailor's board. */
export type OrderCard = {
	id: string;
	commissionId: string;
	title: string;
	garmentType: string | null;
	status: OrderStatus;
	priceMinor: number;
	tailorPayoutMinor: number;
	currency: string;
	dueDate: string;
	createdAt: string;
	/** The other party: the workroom for a customer, "Wenna P." for a tailor. */
	counterpart: string;
	releaseRequested: boolean;
	alterationRequested: boolean;
};

export const boardColumns = ['to_start', 'in_work', 'ready', 'delivered', 'finished'] as const;
export type BoardColumn = (typeof boardColumns)[number];

export type BoardCard = OrderCard & { overdue: boolean; dueThisWeek: boolean };

/** A workroom as order pages name it: its name and where it is, never coordinates. */
export type WorkroomLabel = { name: string; slug: string; town: string; district: string | null };
