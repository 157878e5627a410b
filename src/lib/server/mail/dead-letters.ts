import * as audit from '../audit';
import type { Executor } from '../db';
import * as jobs from '../jobs';
import type { Mail } from './types';

export type DeadLetter = { id: string; to: string; subject: string; lastError: string; failedAt: Date };

function lastError(output: unknown): string {
	const found = output as { message?: unknown; value?: { message?: unknown } } | null;
	const message = found?.message ?? found?.value?.message;
	return typeof message === 'string' && message.trim() ? message.trim().slice(0, 500) : 'No error was recorded.';
}

/** Mail that failed every retry, newest first. */
export async function listDeadLetters(db: Executor, { limit = 100 } = {}): Promise<DeadLetter[]> {
	const waiting = await jobs.listWaiting<Mail>(db, jobs.queueNames.mailDeadLetter, { limit });
	return waiting.map((job) => ({
		id: job.id,
		to: job.data.to,
		subject: job.data.subject,
		lastError: lastError(job.output),
		failedAt: job.createdOn
	}));
}

/** Queues a dead letter for sending again (with fresh retries). False when it was already handled. */
export async function resendDeadLetter(db: Executor, input: { id: string; actorId: string }) {
	return db.transaction(async (tx) => {
		const mail = await jobs.takeWaiting<Mail>(tx, jobs.queueNames.mailDeadLetter, input.id);
		if (!mail) return false;
		await jobs.enqueue(tx, jobs.queueNames.mail, mail);
		await audit.record(tx, { actorId: input.actorId, action: 'mail.resend', subjectType: 'mail', subjectId: input.id });
		return true;
	});
}

/** Drops a dead letter for good. False when it was already handled. */
export async function discardDeadLetter(db: Executor, input: { id: string; actorId: string }) {
	return db.transaction(async (tx) => {
		const mail = await jobs.takeWaiting<Mail>(tx, jobs.queueNames.mailDeadLetter, input.id);
		if (!mail) return false;
		await audit.record(tx, {
			actorId: input.actorId,
			action: 'mail.discard',
			subjectType: 'mail',
			subjectId: input.id,
			data: { subject: mail.subject }
		});
		return true;
	});
}
