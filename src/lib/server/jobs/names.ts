/** Every job queue's name. Add a queue here and its definition in `./queues.ts`. */
export const queueNames = {
	mail: 'mail-send',
	/** Mail that failed every retry waits here, with its last error, until an admin acts on the desk. */
	mailDeadLetter: 'mail-dead-letter',
	/** Every few minutes: open commissions past their expiry with no accepted quote become `expired`. */
	commissionExpiry: 'commission-expiry',
	/** Every few minutes: sent quotes past their valid-until date become `lapsed`. */
	quoteLapse: 'quote-lapse',
	/** Every minute: one mail per person about messages that have waited unread for 15 minutes. */
	messageDigest: 'message-digest',
	/** Drains the search outbox into the indexes; every minute too, so the index catches up after an outage. */
	searchSync: 'search-sync',
	/** Transfers an order's payout to the tailor once release was asked for; retried until the processor answers. */
	orderRelease: 'order-release',
	/** Refunds an order's customer (reversing a paid advance first); retried until the processor answers. */
	orderRefund: 'order-refund',
	/** Transfers an order's materials advance once the customer approved the fabric; retried likewise. */
	orderAdvance: 'order-advance',
	/** Every few minutes: delivered orders whose release clock has run out are released. */
	orderAutoRelease: 'order-auto-release'
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];
