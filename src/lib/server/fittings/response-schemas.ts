import { z } from 'zod';
import type { FittingView } from './queries';

const instant = z.iso.datetime({ offset: true });

export const fittingResponse = z
	.object({
		id: z.uuid(),
		orderId: z.uuid(),
		status: z.enum(['proposed', 'confirmed', 'done', 'cancelled']).meta({
			description:
				'proposed: offered and open to book; confirmed: booked; done: it took place; cancelled: withdrawn or cancelled.'
		}),
		startsAt: instant.meta({ description: 'The start as an instant (UTC).' }),
		endsAt: instant,
		durationMinutes: z.int(),
		timeZone: z.string().meta({ description: 'The IANA zone the time was offered in.' }),
		localStart: z.string().meta({ description: 'The start on the wall clock of `timeZone`, e.g. 2026-12-10T14:30.' }),
		placeKind: z.enum(['workroom', 'public_place', 'customer_home']),
		place: z.string().meta({ description: 'Where, in words.' }),
		notes: z.string(),
		bookedAt: instant.nullable(),
		cancelledBy: z.enum(['customer', 'tailor']).nullable(),
		cancelReason: z.string(),
		changeableUntil: instant.meta({
			description: 'Until when the customer may book, move or cancel it online (the cut-off before the start).'
		}),
		when: z.array(z.string()).meta({
			description:
				'The time for people: the caller’s own zone first, then the fitting’s and the other person’s when they differ.'
		})
	})
	.meta({ id: 'Fitting' });

export const fittingListResponse = z
	.object({
		items: z.array(fittingResponse),
		cutoffHours: z.int().meta({ description: 'How many hours before the start online changes close.' })
	})
	.meta({ id: 'FittingList' });

export type FittingJson = z.output<typeof fittingResponse>;

export function fittingJson(view: FittingView): FittingJson {
	return {
		id: view.id,
		orderId: view.orderId,
		status: view.status,
		startsAt: view.startsAt.toISOString(),
		endsAt: view.endsAt.toISOString(),
		durationMinutes: view.durationMinutes,
		timeZone: view.timeZone,
		localStart: view.localStart,
		placeKind: view.placeKind,
		place: view.place,
		notes: view.notes,
		bookedAt: view.bookedAt?.toISOString() ?? null,
		cancelledBy: view.cancelledBy,
		cancelReason: view.cancelReason,
		changeableUntil: view.changeableUntil.toISOString(),
		when: view.when
	};
}
