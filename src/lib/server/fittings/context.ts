import { and, eq, sql } from 'drizzle-orm';
import type { OrderSummary } from '$lib/types/order';
import * as accounts from '../accounts';
import { publicOrigin } from '../auth/origin';
import type { Executor } from '../db';
import { fitting, type Fitting } from '../db/schema';
import * as orders from '../orders';
import { mailFrom } from '../services/mailer';
import * as workrooms from '../workrooms';
import { FittingError } from './errors';

/** Who acts: the signed-in person, with the request's address for the audit log. */
export type Actor = { id: string; role: 'customer' | 'tailor' | 'admin'; ip?: string | null };

export type Side = 'customer' | 'tailor';

/** Who reads an order's fittings: one of its two people, or an admin (read-only, e.g. settling a dispute). */
export type Reader = Side | 'admin';

export type Person = { id: string; name: string | null; timeZone: string };

/** An order with both people and the workroom, as fitting changes and their notices need them. */
export type OrderContext = {
	order: OrderSummary;
	customer: Person;
	tailor: Person;
	workroom: { name: string; town: string; district: string | null };
};

export const noSuchOrder = () => new FittingError('not_found', 'There is no such order.');
export const noSuchFitting = () => new FittingError('not_found', 'There is no such fitting.');

/** Orders whose garment is still being made: fittings are offered and booked only then. */
export const fittingStatuses = new Set<OrderSummary['status']>(['funded', 'in_work', 'ready']);

async function person(db: Executor, id: string): Promise<Person> {
	const profile = await accounts.getProfile(db, { id });
	return { id, name: profile?.name ?? null, timeZone: profile?.timeZone || 'UTC' };
}

/** The order as one of its two parties sees it, with which side they are on; anyone else finds no order. */
export async function orderFor(db: Executor, orderId: string, actor: Actor) {
	const order = await orders.getForParty(db, { viewerId: actor.id, orderId });
	if (!order) throw noSuchOrder();
	const side: Side = order.customerId === actor.id ? 'customer' : 'tailor';
	return { order, side };
}

/** The order for reading its fittings: its two people, and admins read-only; anyone else finds no order. */
export async function orderForReader(db: Executor, orderId: string, actor: Actor) {
	const order = await orders.getForViewer(db, { viewer: actor, orderId });
	if (!order) throw noSuchOrder();
	const side: Reader = order.customerId === actor.id ? 'customer' : order.tailorId === actor.id ? 'tailor' : 'admin';
	return { order, side };
}

/** The admin reading an order's fittings, as a person whose zone their times are shown in. */
export function readerPerson(db: Executor, id: string): Promise<Person> {
	return person(db, id);
}

/**
 * The order's two people and its workroom. One read after another: inside a transaction `db` is a single
 * connection, which must not be handed several queries at once (pg deprecates it, and pg 9 refuses it).
 */
export async function contextOf(db: Executor, order: OrderSummary): Promise<OrderContext> {
	const customer = await person(db, order.customerId);
	const tailor = await person(db, order.tailorId);
	const workroom = await workrooms.getOwn(db, { tailorId: order.tailorId });
	return {
		order,
		customer,
		tailor,
		workroom: {
			name: workroom?.name ?? 'The workroom',
			town: workroom?.location.town ?? '',
			district: workroom?.location.district ?? null
		}
	};
}

/** Fitting changes on one order queue behind each other (offers, bookings, moves and cancellations). */
export async function lockOrderFittings(tx: Executor, orderId: string) {
	await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`fittings:${orderId}`}))`);
}

/** The fitting's order id, read without a lock: the caller then takes the order's fitting lock and re-reads. */
export async function orderIdOf(db: Executor, fittingId: string) {
	const [row] = await db.select({ orderId: fitting.orderId }).from(fitting).where(eq(fitting.id, fittingId)).limit(1);
	return row?.orderId ?? null;
}

/** A fitting's order as one of its parties sees it; to anyone else the fitting does not exist. */
export async function partyForFitting(db: Executor, fittingId: string, actor: Actor) {
	const orderId = await orderIdOf(db, fittingId);
	const order = orderId ? await orders.getForParty(db, { viewerId: actor.id, orderId }) : null;
	if (!orderId || !order) throw noSuchFitting();
	const side: Side = order.customerId === actor.id ? 'customer' : 'tailor';
	return { orderId, order, side };
}

export async function lockFitting(tx: Executor, fittingId: string, orderId: string): Promise<Fitting> {
	const [row] = await tx
		.select()
		.from(fitting)
		.where(and(eq(fitting.id, fittingId), eq(fitting.orderId, orderId)))
		.for('update')
		.limit(1);
	if (!row) throw noSuchFitting();
	return row;
}

/** Where the fitting is, in words: a public place as named, or the workroom with its directions or its town. */
export function placeText(row: Pick<Fitting, 'placeKind' | 'address'>, workroom: OrderContext['workroom']) {
	if (row.placeKind === 'public_place') return row.address;
	const where = row.address || [workroom.district, workroom.town].filter(Boolean).join(', ');
	return where ? `${workroom.name}, ${where}` : workroom.name;
}

export function fittingsHref(orderId: string) {
	return `/orders/${orderId}/fittings`;
}

/** The sender calendar files name as organiser (Tackline's own address: nobody's private e-mail travels in them). */
export function organizer(workroomName: string) {
	const from = mailFrom();
	const email = /<([^>]+)>/.exec(from)?.[1] ?? from;
	return { name: workroomName, email: email.trim() };
}

export function publicLink(path: string) {
	return `${publicOrigin()}${path}`;
}

export function calendarHost() {
	return new URL(publicOrigin()).hostname;
}
