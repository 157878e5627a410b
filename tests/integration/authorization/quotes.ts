/**
 * Quotes: the tailor with complete onboarding sends and manages their own; the commission's owner reads
 * every quote on it; other tailors see only their own; nobody else learns a quote exists.
 */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { quote } from '../../../src/lib/server/db/schema';
import { createCommission } from '../../factories';
import { completeOnboarding, createQuote } from '../../factories/quotes';
import { partiesApi, signInRedirect, suspendedRedirect, type Expectations, type Row, type World } from './matrix';

type Arranged = { commissionId: string; quoteId: string | null; secrets: string[]; before: unknown };

/** The owner's surname: nobody but the owner sees it, quoting tailors included. */
const surname = 'Polglase';
const later = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

// The matrix's onboarded tailor has the factory's basics; quoting needs every step, done once per run.
const ready = new Map<string, Promise<void>>();
function readyToQuote(world: World) {
	const id = world.cast.tailor.id!;
	if (!ready.has(id)) ready.set(id, completeOnboarding(world.db, id));
	return ready.get(id)!;
}

const quotesOf = (world: World, commissionId: string) =>
	world.db.select().from(quote).where(eq(quote.commissionId, commissionId));

/** An open commission of the owner's; with `quoted`, the matrix's tailor has a quote waiting on it. */
async function arrange(world: World, { quoted }: { quoted: boolean }): Promise<Arranged> {
	await readyToQuote(world);
	const { id } = await createCommission(world.db, {
		customerId: world.cast.owner.id!,
		status: 'open',
		dateNeeded: later(60),
		expiresAt: new Date(Date.now() + 20 * 86_400_000)
	});
	const made = quoted ? await createQuote(world.db, { commissionId: id, tailorId: world.cast.tailor.id! }) : null;
	return { commissionId: id, quoteId: made?.id ?? null, secrets: [surname], before: await quotesOf(world, id) };
}

async function untouched(world: World, { commissionId, before }: Arranged) {
	expect(await quotesOf(world, commissionId)).toEqual(before);
}

/** A form action's success is a redirect too, so refusals are told apart by whose quotes exist. */
async function onlyTheTailorQuoted(world: World, { commissionId }: Arranged) {
	const rows = await quotesOf(world, commissionId);
	expect(rows.filter((row) => row.tailorId !== world.cast.tailor.id)).toEqual([]);
}

const terms = () => ({
	priceMinor: 18500,
	currency: 'EUR',
	deliveryDate: later(30),
	fittings: 1,
	fabricIncluded: true,
	message: 'Two fittings at the workroom.',
	validUntil: later(10)
});

const formTerms = () => ({
	price: '185',
	deliveryDate: later(30),
	fittings: '1',
	fabricIncluded: 'on',
	message: 'Two fittings at the workroom.',
	validUntil: later(10)
});

/** The quote's tailor alone may change it; other tailors are told it does not exist, everyone else 403. */
const tailorsOwn = (success: number): Expectations => ({
	anonymous: 401,
	owner: 403,
	otherCustomer: 403,
	tailor: success,
	tailorOnboarding: 404,
	admin: 403,
	suspended: 401
});

/** A tailor's page: everyone else is turned away, signed-out people asked to sign in. */
const tailorPage = (tailor: Expectations['tailor'], tailorOnboarding: Expectations['tailor']): Expectations => ({
	anonymous: signInRedirect,
	owner: 403,
	otherCustomer: 403,
	tailor,
	tailorOnboarding,
	admin: 403,
	suspended: suspendedRedirect
});

const api = '/api/v1';

export const quoteRows: Row<Arranged>[] = [
	{
		name: `POST ${api}/commissions/{id}/quotes`,
		arrange: (world) => arrange(world, { quoted: false }),
		send: (client, { commissionId }) => client.json('POST', `${api}/commissions/${commissionId}/quotes`, terms()),
		expect: { ...tailorsOwn(201), tailorOnboarding: 403 },
		unchanged: untouched
	},
	{
		name: `GET ${api}/commissions/{id}/quotes`,
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { commissionId }) => client.json('GET', `${api}/commissions/${commissionId}/quotes`),
		// Another tailor may read the open commission, and so its list: with their own quotes only (none).
		expect: {
			anonymous: 401,
			owner: 200,
			otherCustomer: 404,
			tailor: 200,
			tailorOnboarding: 200,
			admin: 200,
			suspended: 401
		}
	},
	{
		name: `GET ${api}/quotes/{id}`,
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { quoteId }) => client.json('GET', `${api}/quotes/${quoteId}`),
		expect: partiesApi()
	},
	{
		name: `PATCH ${api}/quotes/{id}`,
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { quoteId }) => client.json('PATCH', `${api}/quotes/${quoteId}`, { priceMinor: 19900 }),
		expect: tailorsOwn(200),
		unchanged: untouched
	},
	{
		name: `POST ${api}/quotes/{id}/withdraw`,
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { quoteId }) => client.json('POST', `${api}/quotes/${quoteId}/withdraw`),
		expect: tailorsOwn(200),
		unchanged: untouched
	},
	{
		name: 'GET /commissions/{id}/quote',
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { commissionId }) => client.get(`/commissions/${commissionId}/quote`),
		// A tailor still onboarding sees the page, with what is missing instead of the form.
		expect: tailorPage(200, 200)
	},
	{
		name: 'POST /commissions/{id}/quote?/send',
		arrange: (world) => arrange(world, { quoted: false }),
		send: (client, { commissionId }) => client.post(`/commissions/${commissionId}/quote?/send`, formTerms()),
		expect: tailorPage({ status: 303, location: /^\/commissions\/[0-9a-f-]+\/quote\?sent=1$/ }, 403),
		unchanged: onlyTheTailorQuoted
	},
	{
		name: 'POST /commissions/{id}/quote?/withdraw',
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client, { commissionId }) => client.post(`/commissions/${commissionId}/quote?/withdraw`),
		// The tailor's own success is a redirect as well; the API row above checks refusals change nothing.
		expect: tailorPage({ status: 303, location: /^\/commissions\/[0-9a-f-]+\/quote\?withdrawn=1$/ }, 404)
	},
	{
		name: 'GET /workroom/quotes',
		arrange: (world) => arrange(world, { quoted: true }),
		send: (client) => client.get('/workroom/quotes'),
		expect: tailorPage(200, 200)
	}
];
