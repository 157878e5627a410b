import { getVtimezoneComponent } from '@touch4it/ical-timezones';
import ical, { ICalCalendarMethod, ICalEventStatus } from 'ical-generator';
import { DateTime } from 'luxon';
import type { MailAttachment } from '../mail';

export type CalendarFitting = {
	id: string;
	startsAt: Date;
	endsAt: Date;
	timeZone: string;
	placeText: string;
	notes: string;
};

export type CalendarOptions = {
	/** REQUEST while the fitting is booked; CANCEL once it is not. */
	method: 'request' | 'cancel';
	/** Bumped on every change to the fitting, so calendars replace the older copy. */
	sequence: number;
	workroomName: string;
	organizer: { name: string; email: string };
	/** The order's fittings page, for the event's link. */
	url: string;
	/** The host part of the UID: the same fitting always has the same UID. */
	host: string;
};

/** The one UID a fitting keeps in every calendar file, booked or cancelled. */
export function fittingUid(fittingId: string, host: string) {
	return `fitting-${fittingId}@${host}`;
}

/**
 * The fitting as an iCalendar file: times written in the fitting's own zone (TZID) with that zone's VTIMEZONE, a
 * stable UID, the sequence given, and METHOD:REQUEST or CANCEL.
 */
export function fittingCalendar(fitting: CalendarFitting, options: CalendarOptions): string {
	const calendar = ical({
		prodId: { company: 'Tackline', product: 'Fittings', language: 'EN' },
		name: 'Tackline fitting',
		method: options.method === 'cancel' ? ICalCalendarMethod.CANCEL : ICalCalendarMethod.REQUEST,
		// No calendar-wide zone: with one, DTSTAMP would lose its UTC "Z". The event names its zone; the generator adds its VTIMEZONE.
		timezone: { name: null, generator: getVtimezoneComponent }
	});
	calendar.createEvent({
		id: fittingUid(fitting.id, options.host),
		sequence: options.sequence,
		start: DateTime.fromJSDate(fitting.startsAt, { zone: fitting.timeZone }),
		end: DateTime.fromJSDate(fitting.endsAt, { zone: fitting.timeZone }),
		timezone: fitting.timeZone,
		summary: `Fitting at ${options.workroomName}`,
		location: fitting.placeText,
		description: [fitting.notes, `Details and changes: ${options.url}`].filter(Boolean).join('\n\n'),
		organizer: options.organizer,
		url: options.url,
		status: options.method === 'cancel' ? ICalEventStatus.CANCELLED : ICalEventStatus.CONFIRMED
	});
	return calendar.toString();
}

/** The file as a mail attachment (`text/calendar` with its method, as mail clients expect). */
export function calendarAttachment(content: string, method: 'request' | 'cancel'): MailAttachment {
	return {
		filename: method === 'cancel' ? 'fitting-cancelled.ics' : 'fitting.ics',
		contentType: `text/calendar; charset=utf-8; method=${method.toUpperCase()}`,
		content
	};
}
