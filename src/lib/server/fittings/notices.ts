import type { Fitting } from '../db/schema';
import { meetingSafetyText } from '$lib/fittings/safety';
import * as audit from '../audit';
import type { Executor } from '../db';
import { notify } from '../notifications';
import type { MailAttachment } from '../mail';
import {
	calendarHost,
	fittingsHref,
	organizer,
	placeText,
	publicLink,
	type OrderContext,
	type Person,
	type Side
} from './context';
import { calendarAttachment, fittingCalendar } from './ics';
import { describeRange, shortStart, zoneLabel } from './time';

/** The fitting's time for one person: their own zone first, then the fitting's and the other person's when they differ. */
export function whenLines(row: Pick<Fitting, 'startsAt' | 'endsAt' | 'timeZone'>, viewer: Person, other: Person) {
	const zones = [viewer.timeZone, row.timeZone, other.timeZone].filter((zone, i, all) => all.indexOf(zone) === i);
	return zones.map((zone) => describeRange(row.startsAt, row.endsAt, zone));
}

function whenText(row: Fitting, viewer: Person, other: Person) {
	const [own, ...others] = whenLines(row, viewer, other);
	return others.length ? `${own}\n(that is ${others.join('; ')})` : own;
}

function sides(ctx: OrderContext, side: Side) {
	return side === 'customer' ? { me: ctx.customer, other: ctx.tailor } : { me: ctx.tailor, other: ctx.customer };
}

/** Every change to a fitting is one audit event, so the count of its events is the calendar's SEQUENCE. */
export async function sequenceOf(db: Executor, fittingId: string) {
	const history = await audit.historyFor(db, { subjectType: 'fitting', subjectId: fittingId, limit: 1000 });
	return Math.max(0, history.length - 1);
}

/** The fitting's calendar file as it stands now: REQUEST while booked, CANCEL otherwise. */
export async function calendarFile(db: Executor, row: Fitting, ctx: OrderContext) {
	const method = row.status === 'confirmed' || row.status === 'done' ? ('request' as const) : ('cancel' as const);
	const content = fittingCalendar(
		{
			id: row.id,
			startsAt: row.startsAt,
			endsAt: row.endsAt,
			timeZone: row.timeZone,
			placeText: placeText(row, ctx.workroom),
			notes: row.notes
		},
		{
			method,
			sequence: await sequenceOf(db, row.id),
			workroomName: ctx.workroom.name,
			organizer: organizer(ctx.workroom.name),
			url: publicLink(fittingsHref(row.orderId)),
			host: calendarHost()
		}
	);
	return { content, method };
}

async function attachmentOf(db: Executor, row: Fitting, ctx: OrderContext): Promise<MailAttachment> {
	const file = await calendarFile(db, row, ctx);
	return calendarAttachment(file.content, file.method);
}

function changeRule(side: Side, cutoffHours: number, ctx: OrderContext) {
	return side === 'customer'
		? `You can move or cancel it on the order’s fittings page until ${cutoffHours} hours before it starts; after that, message ${ctx.workroom.name}.`
		: `The customer can move or cancel it online until ${cutoffHours} hours before it starts. If you cannot make it, cancel it on the fittings page with a reason.`;
}

/** New times to choose from, told to the customer in their own zone. */
export async function tellOffered(tx: Executor, ctx: OrderContext, rows: Fitting[]) {
	const lines = rows.map((row) => `- ${whenText(row, ctx.customer, ctx.tailor)}\n  ${placeText(row, ctx.workroom)}`);
	await notify(tx, {
		userId: ctx.customer.id,
		event: 'fitting_offered',
		title: `${ctx.workroom.name} offered ${rows.length === 1 ? 'a fitting time' : `${rows.length} fitting times`}`,
		body: `${ctx.workroom.name} would like to see you for a fitting. Book the time that suits you:\n\n${lines.join('\n')}`,
		href: fittingsHref(ctx.order.id)
	});
}

/** A booking (or a move to another time), told to both people with the calendar file(s). */
export async function tellBooked(
	tx: Executor,
	ctx: OrderContext,
	{ booked, released, cutoffHours }: { booked: Fitting; released: Fitting | null; cutoffHours: number }
) {
	const files = [await attachmentOf(tx, booked, ctx)];
	if (released) files.push(await attachmentOf(tx, released, ctx));
	for (const side of ['customer', 'tailor'] as const) {
		const { me, other } = sides(ctx, side);
		const moved = released
			? `\n\nThis replaces the fitting booked for ${describeRange(released.startsAt, released.endsAt, me.timeZone)}.`
			: '';
		await notify(tx, {
			userId: me.id,
			event: 'fitting_booked',
			title: `${released ? 'Fitting moved' : 'Fitting booked'}: ${shortStart(booked.startsAt, me.timeZone)}`,
			body: [
				`${side === 'customer' ? 'Your fitting is booked.' : 'Your customer booked a fitting.'}${moved}`,
				`When: ${whenText(booked, me, other)}`,
				`Where: ${placeText(booked, ctx.workroom)}`,
				booked.notes ? `Notes: ${booked.notes}` : '',
				'The attached calendar file adds it to your calendar.',
				changeRule(side, cutoffHours, ctx),
				meetingSafetyText()
			]
				.filter(Boolean)
				.join('\n\n'),
			href: fittingsHref(ctx.order.id),
			attachments: files
		});
	}
}

/** A cancelled booking, told to the other person, with the calendar file that takes it out of their calendar. */
export async function tellCancelled(tx: Executor, ctx: OrderContext, row: Fitting, by: Side) {
	const { me } = sides(ctx, by === 'customer' ? 'tailor' : 'customer');
	const who = by === 'customer' ? 'Your customer' : ctx.workroom.name;
	await notify(tx, {
		userId: me.id,
		event: 'fitting_cancelled',
		title: `Fitting cancelled: ${shortStart(row.startsAt, me.timeZone)}`,
		body: [
			`${who} cancelled the fitting on ${describeRange(row.startsAt, row.endsAt, me.timeZone)}.`,
			row.cancelReason ? `Reason: ${row.cancelReason}` : '',
			by === 'customer'
				? 'Offer new times on the fittings page when you are ready.'
				: 'Book another offered time on the fittings page, or message the workroom.',
			'The attached calendar file removes it from your calendar.'
		]
			.filter(Boolean)
			.join('\n\n'),
		href: fittingsHref(ctx.order.id),
		attachments: [await attachmentOf(tx, row, ctx)]
	});
}

/** The day-before reminder, to one person. */
export async function tellReminder(tx: Executor, ctx: OrderContext, row: Fitting, side: Side) {
	const { me, other } = sides(ctx, side);
	await notify(tx, {
		userId: me.id,
		event: 'fitting_reminder',
		title: `Fitting reminder: ${shortStart(row.startsAt, me.timeZone)}`,
		body: [
			side === 'customer'
				? `A reminder of your fitting with ${ctx.workroom.name}.`
				: 'A reminder of your fitting with your customer.',
			`When: ${whenText(row, me, other)}`,
			`Where: ${placeText(row, ctx.workroom)}`,
			row.notes ? `Notes: ${row.notes}` : '',
			`Times are shown in ${zoneLabel(me.timeZone)}, the time zone in your account settings.`,
			meetingSafetyText()
		]
			.filter(Boolean)
			.join('\n\n'),
		href: fittingsHref(ctx.order.id)
	});
}
