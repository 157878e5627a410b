import { describe, expect, it } from 'vitest';
import type { PaymentHistoryItem, ProgressStepView, StatusChange } from '$lib/types/order-page';
import { columnOfStatus, decodeCursor, dueFlags, encodeCursor } from './board';
import { buildTimeline } from './page';

const step = (id: string, at: string): ProgressStepView => ({
	id,
	kind: 'cutting',
	note: '',
	recordedAt: at,
	photo: null
});
const paid = (id: string, at: string): PaymentHistoryItem => ({
	id,
	kind: 'charge',
	amountMinor: 1000,
	currency: 'EUR',
	status: 'succeeded',
	failureReason: null,
	at
});
const change = (id: string, action: string, at: string): StatusChange => ({ id, action, at, by: null, reason: null });

describe('the order timeline', () => {
	it('merges progress, payments and changes oldest first, a change before what it caused at the same instant', () => {
		const items = buildTimeline({
			steps: [step('s1', '2026-03-04T10:00:00.000Z')],
			payments: [paid('p1', '2026-03-02T09:00:00.000Z')],
			changes: [
				change('c1', 'order.created', '2026-03-01T08:00:00.000Z'),
				change('c2', 'order.ready', '2026-03-04T10:00:00.000Z')
			]
		});
		expect(items.map((item) => item.id)).toEqual(['c1', 'p1', 'c2', 's1']);
	});

	it('leaves out the changes the caller does not want told twice', () => {
		const items = buildTimeline(
			{
				steps: [],
				payments: [],
				changes: [
					change('c1', 'order.created', '2026-03-01T08:00:00.000Z'),
					change('c2', 'order.funded', '2026-03-02T08:00:00.000Z')
				]
			},
			(c) => c.action !== 'order.funded'
		);
		expect(items.map((item) => item.id)).toEqual(['c1']);
	});
});

describe('the workroom board', () => {
	const today = '2026-05-13';

	it('flags an order due before today as overdue, and one due within seven days as due this week', () => {
		expect(dueFlags({ dueDate: '2026-05-12', status: 'in_work' }, today)).toEqual({
			overdue: true,
			dueThisWeek: false
		});
		expect(dueFlags({ dueDate: '2026-05-13', status: 'funded' }, today)).toEqual({ overdue: false, dueThisWeek: true });
		expect(dueFlags({ dueDate: '2026-05-19', status: 'ready' }, today)).toEqual({ overdue: false, dueThisWeek: true });
		expect(dueFlags({ dueDate: '2026-05-20', status: 'ready' }, today)).toEqual({ overdue: false, dueThisWeek: false });
	});

	it('never flags an order already handed over', () => {
		for (const status of ['delivered', 'released', 'cancelled', 'refunded'] as const)
			expect(dueFlags({ dueDate: '2026-01-01', status }, today)).toEqual({ overdue: false, dueThisWeek: false });
	});

	it('puts every status in one column', () => {
		expect(columnOfStatus.awaiting_payment).toBe('to_start');
		expect(columnOfStatus.disputed).toBe('delivered');
		expect(columnOfStatus.settled).toBe('finished');
	});

	it('reads back its own cursor and nothing else', () => {
		const card = { dueDate: '2026-04-01', id: '3f2b8a4e-8f6d-4c1b-9a57-2d1e0c9b7a65' };
		expect(decodeCursor(encodeCursor(card))).toEqual({ d: card.dueDate, i: card.id });
		expect(decodeCursor('not-a-cursor')).toBeNull();
		expect(decodeCursor(Buffer.from('{"d":"tomorrow","i":"x"}').toString('base64url'))).toBeNull();
	});
});
