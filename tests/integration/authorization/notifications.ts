/**
 * Notices and notification settings belong to one person: everyone signed in reads and changes only their own
 * (another person's notice is neither shown, marked nor opened), and nobody signed out gets any.
 */
import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import { expect } from 'vitest';
import { notification } from '../../../src/lib/server/db/schema';
import type { Client } from '../http';
import { signInRedirect, suspendedRedirect, type Expectations, type Row, type World } from './matrix';

type Notice = { id: string; secrets: string[] };

/** An unread notice of the owner's whose title only the owner may ever see. */
async function ownersNotice({ db, cast }: World): Promise<Notice> {
	const secret = `Fabric for order ${randomUUID().slice(0, 8)}`;
	const [row] = await db
		.insert(notification)
		.values({ userId: cast.owner.id!, event: 'fabric_approval', title: secret, body: '', href: '/notifications' })
		.returning({ id: notification.id });
	return { id: row.id, secrets: [secret] };
}

async function stillUnread({ db }: World, { id }: Notice) {
	const rows = await db
		.select({ id: notification.id })
		.from(notification)
		.where(and(eq(notification.id, id), isNull(notification.readAt)));
	expect(rows, 'the owner’s notice is still unread').toHaveLength(1);
}

/** Every signed-in person gets `ok` (on their own things); signed-out and suspended people get 401. */
const ownApi = (ok: number): Expectations => ({
	anonymous: 401,
	owner: ok,
	otherCustomer: ok,
	tailor: ok,
	tailorOnboarding: ok,
	admin: ok,
	suspended: 401
});

const ownPage = (ok: Expectations['owner']): Expectations => ({
	anonymous: signInRedirect,
	owner: ok,
	otherCustomer: ok,
	tailor: ok,
	tailorOnboarding: ok,
	admin: ok,
	suspended: suspendedRedirect
});

const json = (client: Client, method: string, path: string, body?: unknown) => client.json(method, path, body);

export const notificationRows: Row<Notice>[] = [
	{
		name: 'GET /api/v1/notifications',
		arrange: ownersNotice,
		send: (client) => json(client, 'GET', '/api/v1/notifications'),
		expect: ownApi(200),
		revealsToOwner: true
	},
	{
		name: 'POST /api/v1/notifications/read (the owner’s notice)',
		arrange: ownersNotice,
		send: (client, { id }) => json(client, 'POST', '/api/v1/notifications/read', { ids: [id] }),
		expect: ownApi(200),
		unchanged: stillUnread
	},
	{
		name: 'POST /api/v1/notifications/read (all)',
		arrange: ownersNotice,
		send: (client) => json(client, 'POST', '/api/v1/notifications/read', { all: true }),
		expect: ownApi(200),
		unchanged: stillUnread
	},
	{
		name: 'GET /api/v1/account/notification-preferences',
		arrange: ownersNotice,
		send: (client) => json(client, 'GET', '/api/v1/account/notification-preferences'),
		expect: ownApi(200)
	},
	{
		name: 'PUT /api/v1/account/notification-preferences',
		arrange: ownersNotice,
		send: (client) =>
			json(client, 'PUT', '/api/v1/account/notification-preferences', {
				events: [{ event: 'message_waiting', email: true, inApp: true }]
			}),
		expect: ownApi(200)
	},
	{
		name: 'GET /notifications',
		arrange: ownersNotice,
		send: (client) => client.get('/notifications'),
		expect: ownPage(200),
		revealsToOwner: true
	},
	{
		name: 'POST /notifications?/open (the owner’s notice)',
		arrange: ownersNotice,
		send: (client, { id }) => client.post('/notifications?/open', { id }),
		expect: {
			...ownPage(404),
			owner: { status: 303, location: /^\/notifications$/ }
		},
		unchanged: stillUnread
	},
	{
		name: 'POST /notifications?/read (the owner’s notice)',
		arrange: ownersNotice,
		send: (client, { id }) => client.post('/notifications?/read', { id }),
		expect: ownPage(200),
		unchanged: stillUnread
	},
	{
		name: 'POST /notifications?/readAll',
		arrange: ownersNotice,
		send: (client) => client.post('/notifications?/readAll', {}),
		expect: ownPage(200),
		unchanged: stillUnread
	},
	{
		name: 'GET /account/notifications',
		arrange: ownersNotice,
		send: (client) => client.get('/account/notifications'),
		expect: ownPage(200)
	},
	{
		name: 'POST /account/notifications?/save',
		arrange: ownersNotice,
		send: (client) => client.post('/account/notifications?/save', { 'message_waiting.email': 'on' }),
		expect: ownPage(200)
	}
];
