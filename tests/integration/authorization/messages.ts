/**
 * Conversations: only the commission's customer and the thread's tailor read or write one; everyone else is
 * told it does not exist, and the tailor never learns the customer's surname.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { tailorProfile } from '../../../src/lib/server/db/schema';
import * as messages from '../../../src/lib/server/messages';
import { createCommission } from '../../factories';
import { solid } from '../../factories/images';
import { baseUrl, type Client } from '../http';
import { signInRedirect, suspendedRedirect, tailorPage, type Expectations, type Row, type World } from './matrix';

/** The owner's surname (actors.ts): the tailor sees "Wenna P.". */
const surname = 'Polglase';

type Thread = { id: string; commissionId: string; attachmentId: string | null; secrets: string[] };

/** A thread between the owner and the onboarded tailor, with a message from each. */
async function thread({ db, cast }: World, { withPhoto = false } = {}): Promise<Thread> {
	const { id: commissionId } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
	const tailor = { id: cast.tailor.id!, role: 'tailor' as const };
	const owner = { id: cast.owner.id!, role: 'customer' as const };
	const { id: threadId } = await messages.openThread(db, { commissionId, tailorId: tailor.id });
	await messages.post(db, { threadId, actor: tailor, body: 'Lined or unlined?' });
	const reply = await messages.post(db, {
		threadId,
		actor: owner,
		body: 'Lined, please.',
		attachments: withPhoto ? [{ file: await solid(64, 48).png().toBuffer(), altText: 'Lining swatch' }] : []
	});
	return { id: threadId, commissionId, attachmentId: reply.attachments[0]?.id ?? null, secrets: [surname] };
}

/**
 * An open commission of the owner's with no thread yet. The onboarded tailor is marked onboarded again: rows of
 * other areas change that workroom and may have reopened its onboarding.
 */
async function openCommission({ db, cast }: World): Promise<Thread> {
	const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
	await db.update(tailorProfile).set({ onboardedAt: new Date() }).where(eq(tailorProfile.userId, cast.tailor.id!));
	return { id: randomUUID(), commissionId: id, attachmentId: null, secrets: [surname] };
}

/** The thread's two people get `ok`; everyone else signed in gets 404. */
const participantsApi = (ok: number): Expectations => ({
	anonymous: 401,
	owner: ok,
	otherCustomer: 404,
	tailor: ok,
	tailorOnboarding: 404,
	admin: 404,
	suspended: 401
});

const participantsPage = (ok: number | Expectations['owner']): Expectations => ({
	anonymous: signInRedirect,
	owner: ok,
	otherCustomer: 404,
	tailor: ok,
	tailorOnboarding: 404,
	admin: 404,
	suspended: suspendedRedirect
});

/** The stream never ends by itself: keep its status and first bytes, then hang up. */
async function firstBytes(client: Client, path: string) {
	const cookie = [...client.jar].map(([name, value]) => `${name}=${value}`).join('; ');
	const abort = new AbortController();
	const response = await fetch(baseUrl + path, {
		headers: { origin: baseUrl, 'x-forwarded-for': client.address, ...(cookie ? { cookie } : {}) },
		signal: abort.signal,
		redirect: 'manual'
	});
	const reader = response.body?.getReader();
	const first = reader ? await reader.read() : { value: undefined };
	abort.abort();
	return new Response(first.value ? new TextDecoder().decode(first.value) : '', {
		status: response.status,
		headers: response.headers
	});
}

export const messageRows: Row<Thread>[] = [
	{
		name: 'GET /api/v1/threads',
		arrange: (world) => thread(world),
		send: (client) => client.json('GET', '/api/v1/threads'),
		expect: { ...participantsApi(200), otherCustomer: 200, tailorOnboarding: 200, admin: 200 }
	},
	{
		name: 'GET /api/v1/threads/{id}/messages',
		arrange: (world) => thread(world),
		send: (client, { id }) => client.json('GET', `/api/v1/threads/${id}/messages`),
		expect: participantsApi(200)
	},
	{
		name: 'POST /api/v1/threads/{id}/messages',
		arrange: (world) => thread(world),
		send: (client, { id }) => client.json('POST', `/api/v1/threads/${id}/messages`, { body: 'See you then.' }),
		expect: participantsApi(201)
	},
	{
		name: 'POST /api/v1/threads/{id}/read',
		arrange: (world) => thread(world),
		send: (client, { id }) => client.json('POST', `/api/v1/threads/${id}/read`),
		expect: participantsApi(200)
	},
	{
		name: 'GET /api/v1/threads/{id}/events',
		arrange: (world) => thread(world),
		send: (client, { id }) => firstBytes(client, `/api/v1/threads/${id}/events`),
		expect: participantsApi(200)
	},
	{
		name: 'GET /messages',
		arrange: (world) => thread(world),
		send: (client) => client.get('/messages'),
		expect: { ...participantsPage(200), otherCustomer: 200, tailorOnboarding: 200, admin: 200 }
	},
	{
		name: 'GET /messages/{id}',
		arrange: (world) => thread(world),
		send: (client, { id }) => client.get(`/messages/${id}`),
		expect: participantsPage(200)
	},
	{
		name: 'POST /messages/{id}?/send',
		arrange: (world) => thread(world),
		send: (client, { id }) => client.post(`/messages/${id}?/send`, { body: 'Thank you.' }),
		expect: participantsPage(200)
	},
	{
		name: 'GET /messages/attachments/{id}/thumb',
		arrange: (world) => thread(world, { withPhoto: true }),
		send: (client, { attachmentId }) => client.get(`/messages/attachments/${attachmentId}/thumb`),
		expect: participantsPage(200)
	},
	{
		name: 'GET /messages/ask/{commissionId}',
		arrange: (world) => openCommission(world),
		send: (client, { commissionId }) => client.get(`/messages/ask/${commissionId}`),
		expect: tailorPage(200)
	},
	{
		name: 'POST /messages/ask/{commissionId}?/ask',
		arrange: (world) => openCommission(world),
		send: (client, { commissionId }) =>
			client.post(`/messages/ask/${commissionId}?/ask`, { body: 'Is there a lining?' }),
		expect: {
			anonymous: signInRedirect,
			owner: 403,
			otherCustomer: 403,
			tailor: { status: 303, location: /^\/messages\/[0-9a-f-]{36}$/ },
			tailorOnboarding: 403,
			admin: 403,
			suspended: suspendedRedirect
		}
	}
];
