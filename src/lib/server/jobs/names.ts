/** Every job queue's name. Add a queue here and its definition in `./queues.ts`. */
export const queueNames = {
	mail: 'mail-send',
	/** Mail that failed every retry waits here, with its last error, until an admin acts on the desk. */
	mailDeadLetter: 'mail-dead-letter'
} as const;

export type QueueName = (typeof queueNames)[keyof typeof queueNames];
