import { and, eq, sql } from 'drizzle-orm';
import type { Executor } from '../db';
import { notificationPreference, type NotificationChannel, type NotificationEvent, type UserRole } from '../db/schema';
import { catalogue, eventsFor, groups, type NoticeGroup, type Required } from './catalogue';

/** One row of the preferences grid: an event and whether each channel is on. */
export type EventPreference = {
	event: NotificationEvent;
	group: NoticeGroup;
	label: string;
	description: string;
	/** Set when the event cannot be turned off, and why. */
	required: Required;
	email: boolean;
	inApp: boolean;
};

export type PreferenceGroup = { id: NoticeGroup; title: string; description: string; events: EventPreference[] };

/** A change to one event; a channel left out keeps its setting. */
export type PreferenceChange = { event: NotificationEvent; email?: boolean; inApp?: boolean };

export class PreferenceRefused extends Error {
	constructor(
		message: string,
		readonly issues: { path: string; message: string }[]
	) {
		super(message);
	}
}

/** Whether each channel is on for one person and one event. No row means on; required events are always on. */
export async function wants(
	db: Executor,
	{ userId, event }: { userId: string; event: NotificationEvent }
): Promise<{ email: boolean; inApp: boolean }> {
	if (catalogue[event].required) return { email: true, inApp: true };
	const rows = await db
		.select({ channel: notificationPreference.channel, enabled: notificationPreference.enabled })
		.from(notificationPreference)
		.where(and(eq(notificationPreference.userId, userId), eq(notificationPreference.event, event)));
	const off = (channel: NotificationChannel) => rows.some((row) => row.channel === channel && !row.enabled);
	return { email: !off('email'), inApp: !off('in_app') };
}

/** The person's whole grid: every event their role can receive, with its two channels. */
export async function list(db: Executor, { userId, role }: { userId: string; role: UserRole }) {
	const rows = await db
		.select({
			event: notificationPreference.event,
			channel: notificationPreference.channel,
			enabled: notificationPreference.enabled
		})
		.from(notificationPreference)
		.where(eq(notificationPreference.userId, userId));
	const off = new Set(rows.filter((row) => !row.enabled).map((row) => `${row.event}:${row.channel}`));
	return eventsFor(role).map((event): EventPreference => {
		const info = catalogue[event];
		return {
			event,
			group: info.group,
			label: info.label,
			description: info.description,
			required: info.required,
			email: info.required !== null || !off.has(`${event}:email`),
			inApp: info.required !== null || !off.has(`${event}:in_app`)
		};
	});
}

/** The grid grouped as the page shows it; groups with nothing for this role are left out. */
export async function grouped(db: Executor, who: { userId: string; role: UserRole }): Promise<PreferenceGroup[]> {
	const events = await list(db, who);
	return groups
		.map((group) => ({ ...group, events: events.filter((event) => event.group === group.id) }))
		.filter((group) => group.events.length > 0);
}

/**
 * Saves changes in one statement. Turning off a required event, or naming one the person's role never
 * receives, is refused with the path of each offending change and nothing saved.
 */
export async function save(
	db: Executor,
	{ userId, role, changes }: { userId: string; role: UserRole; changes: PreferenceChange[] }
) {
	const allowed = new Set(eventsFor(role));
	const issues: { path: string; message: string }[] = [];
	changes.forEach((change, i) => {
		const info = catalogue[change.event];
		if (!allowed.has(change.event))
			issues.push({ path: `events.${i}.event`, message: 'Your account never receives this notice.' });
		else if (info.required && (change.email === false || change.inApp === false))
			issues.push({
				path: `events.${i}`,
				message: `“${info.label}” is always sent, because it is about ${info.required === 'money' ? 'money' : 'meeting someone'}.`
			});
	});
	if (issues.length) throw new PreferenceRefused('Some notices cannot be changed.', issues);
	const values = changes.flatMap((change) =>
		(
			[
				['email', change.email],
				['in_app', change.inApp]
			] as const
		)
			.filter((pair): pair is readonly [NotificationChannel, boolean] => pair[1] !== undefined)
			.map(([channel, enabled]) => ({ userId, event: change.event, channel, enabled }))
	);
	if (values.length === 0) return;
	await db
		.insert(notificationPreference)
		.values(values)
		.onConflictDoUpdate({
			target: [notificationPreference.userId, notificationPreference.event, notificationPreference.channel],
			set: { enabled: sql`excluded.enabled` }
		});
}
