/**
 * Deciding on quotes and what acceptance opens up: only the commission's owner accepts or declines; once a
 * quote is accepted, its tailor — and no other tailor — reads the full measurements, through the API and on
 * the page. In these rows `tailor` is the quoting (and, where awarded, the winning) tailor and
 * `tailorOnboarding` a tailor who never quoted.
 */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import { commission, commissionMeasurements, order, quote } from '../../../src/lib/server/db/schema';
import { neededFor } from '../../../src/lib/server/profiles';
import { createCommission, createWorkroom } from '../../factories';
import { awardQuote, insertQuote } from '../../factories/quotes';
import type { Client } from '../http';
import {
	customerApi,
	customerPage,
	partiesApi,
	signInRedirect,
	suspendedRedirect,
	type Row,
	type World
} from './matrix';
import { spellings } from './measurement-profiles';

/** The owner's surname: tailors, the awarded one included, see "Wenna P.". */
const surname = 'Polglase';

type Quoted = {
	id: string;
	quoteId: string;
	secrets: string[];
	/** Every spelling of the measurement values, checked by hand where the awarded tailor may see them. */
	values: string[];
	awardedClient: Client | null;
	world: World;
};

/** An open commission of the owner's with odd measurement values and a live quote from `cast.tailor`. */
async function quoted(world: World): Promise<Quoted> {
	const { db, cast } = world;
	const valuesMm = Object.fromEntries(neededFor('straight-skirt').map((code, i) => [code, 613.29 + 91.07 * i]));
	const { id } = await createCommission(db, { customerId: cast.owner.id!, status: 'open' });
	await db.update(commissionMeasurements).set({ valuesMm }).where(eq(commissionMeasurements.commissionId, id));
	const { id: quoteId } = await insertQuote(db, { commissionId: id, tailorId: cast.tailor.id! });
	const values = spellings(valuesMm);
	return { id, quoteId, secrets: [surname, ...values], values, awardedClient: null, world };
}

/** Awarded to `cast.tailor`: the measurements are theirs to read too, so only the surname stays secret here. */
async function awardedToTailor(world: World): Promise<Quoted> {
	const made = await quoted(world);
	await awardQuote(world.db, { commissionId: made.id, quoteId: made.quoteId, customerId: world.cast.owner.id! });
	return { ...made, secrets: [surname], awardedClient: world.cast.tailor.client };
}

/** Awarded to some other workroom; `cast.tailor`'s quote was declined by the acceptance. */
async function awardedElsewhere(world: World): Promise<Quoted> {
	const made = await quoted(world);
	const winner = await createWorkroom(world.db);
	const { id: quoteId } = await insertQuote(world.db, { commissionId: made.id, tailorId: winner.id });
	await awardQuote(world.db, { commissionId: made.id, quoteId, customerId: world.cast.owner.id! });
	return made;
}

async function undecided({ db }: World, { id, quoteId }: Quoted) {
	const [row] = await db.select({ status: quote.status }).from(quote).where(eq(quote.id, quoteId));
	expect(row.status).toBe('sent');
	expect(await db.select().from(order).where(eq(order.commissionId, id))).toHaveLength(0);
	const [c] = await db.select({ status: commission.status }).from(commission).where(eq(commission.id, id));
	expect(c.status).toBe('open');
}

/**
 * Sends the request and checks the measurements by hand: the owner and the awarded tailor find them, no other
 * successful reader does. Answers an equivalent response for the matrix's own checks.
 */
async function readingMeasurements(client: Client, arranged: Quoted, path: string, asJson: boolean) {
	const response = asJson ? await client.json('GET', path) : await client.get(path);
	const body = await response.text();
	const found = arranged.values.filter((value) =>
		new RegExp(`(?<![\\w.])${value.replace(/[.]/g, '\\.')}(?![\\w])`).test(body)
	);
	if (client === arranged.awardedClient) {
		expect(response.status).toBe(200);
		expect(found.length, 'the awarded tailor reads the measurements').toBeGreaterThan(0);
		if (asJson) expect(JSON.parse(body)).toHaveProperty('measurements');
	} else if (client !== arranged.world.cast.owner.client) {
		expect(found, 'nobody else reads the measurements').toEqual([]);
		if (asJson && response.status === 200) expect(JSON.parse(body)).not.toHaveProperty('measurements');
	}
	return new Response(body, { status: response.status, headers: response.headers });
}

const commissionApi = (id: string) => `/api/v1/commissions/${id}`;

export const acceptRows: Row<Quoted>[] = [
	{
		name: 'POST /api/v1/quotes/{id}/accept',
		arrange: quoted,
		send: (client, { quoteId }) => client.json('POST', `/api/v1/quotes/${quoteId}/accept`),
		expect: customerApi(201, 404),
		unchanged: undecided
	},
	{
		name: 'POST /api/v1/quotes/{id}/decline',
		arrange: quoted,
		send: (client, { quoteId }) => client.json('POST', `/api/v1/quotes/${quoteId}/decline`, { reason: 'Too dear.' }),
		expect: customerApi(200, 404),
		unchanged: undecided
	},
	{
		name: 'POST /commissions/{id}?/accept',
		arrange: quoted,
		send: (client, { id, quoteId }) => client.post(`/commissions/${id}?/accept`, { quoteId }),
		expect: customerPage({ status: 303, location: /\?accepted=1$/ }, 404),
		unchanged: undecided
	},
	{
		name: 'POST /commissions/{id}?/decline',
		arrange: quoted,
		send: (client, { id, quoteId }) => client.post(`/commissions/${id}?/decline`, { quoteId, reason: 'Too far.' }),
		expect: customerPage({ status: 303, location: /\?declined=1/ }, 404),
		unchanged: undecided
	},
	{
		name: 'GET /api/v1/commissions/{id} (awarded to the quoting tailor)',
		arrange: awardedToTailor,
		send: (client, arranged) => readingMeasurements(client, arranged, commissionApi(arranged.id), true),
		expect: partiesApi()
	},
	{
		name: 'GET /api/v1/commissions/{id} (awarded to another tailor)',
		arrange: awardedElsewhere,
		send: (client, arranged) => readingMeasurements(client, arranged, commissionApi(arranged.id), true),
		expect: partiesApi(),
		revealsToOwner: true
	},
	{
		name: 'GET /commissions/{id} (awarded to the quoting tailor)',
		arrange: awardedToTailor,
		send: (client, arranged) => readingMeasurements(client, arranged, `/commissions/${arranged.id}`, false),
		expect: {
			anonymous: signInRedirect,
			owner: 200,
			otherCustomer: 404,
			tailor: 200,
			tailorOnboarding: 404,
			admin: 200,
			suspended: suspendedRedirect
		}
	}
];
