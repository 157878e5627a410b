/**
 * The authorisation matrix: each row is one thing a person can try (a page, a form action, an endpoint),
 * how to send it, and the status every actor must get. Rows live in one file per area beside this one;
 * `describeMatrix` turns them into one test per (row, actor).
 */
import { describe, expect, it } from 'vitest';
import type { Executor } from '../../../src/lib/server/db/client';
import type { Client } from '../http';
import { actorNames, type ActorName, type Cast } from './actors';

export type Outcome = number | { status: number; location: RegExp };
export type Expectations = Record<ActorName, Outcome>;

export type World = { db: Executor; cast: Cast };

/** What `arrange` made for one attempt; `secrets` are strings only the owner may ever receive. */
export type Arranged = { secrets: string[] };

export interface Row<T extends Arranged = Arranged> {
	/** What is tried, as a person reads it: `PATCH /api/v1/measurement-profiles/{id}`. */
	name: string;
	/** Fresh data owned by the owner for each attempt, so one actor's success cannot hide another's. */
	arrange(world: World): Promise<T>;
	send(client: Client, arranged: T): Promise<Response>;
	expect: Expectations;
	/** The owner's successful answer carries the secrets (so their absence elsewhere means something). */
	revealsToOwner?: boolean;
	/** After a refused attempt: proves nothing changed. */
	unchanged?(world: World, arranged: T): Promise<void>;
}

export const signInRedirect: Outcome = { status: 303, location: /^\/sign-in\?redirectTo=/ };
export const suspendedRedirect: Outcome = { status: 303, location: /^\/sign-in\?suspended=1/ };

/** A customer-only JSON endpoint on something the owner has: others' ids do not exist for them. */
export function customerApi(owner: Outcome, otherCustomer: Outcome): Expectations {
	return { anonymous: 401, owner, otherCustomer, tailor: 403, tailorOnboarding: 403, admin: 403, suspended: 401 };
}

/** A customer-only page or form action. */
export function customerPage(owner: Outcome, otherCustomer: Outcome): Expectations {
	return {
		anonymous: signInRedirect,
		owner,
		otherCustomer,
		tailor: 403,
		tailorOnboarding: 403,
		admin: 403,
		suspended: suspendedRedirect
	};
}

/** The same answer for every actor: public things, or things nobody may do. */
export function everyone(status: number): Expectations {
	return {
		anonymous: status,
		owner: status,
		otherCustomer: status,
		tailor: status,
		tailorOnboarding: status,
		admin: status,
		suspended: status
	};
}

/** A tailor-only JSON endpoint, whether or not the tailor has finished setting up. */
export function tailorApi(ok: number): Expectations {
	return {
		anonymous: 401,
		owner: 403,
		otherCustomer: 403,
		tailor: ok,
		tailorOnboarding: ok,
		admin: 403,
		suspended: 401
	};
}

/** A tailor-only page or form action, whether or not the tailor has finished setting up. */
export function tailorPage(ok: Outcome): Expectations {
	return {
		anonymous: signInRedirect,
		owner: 403,
		otherCustomer: 403,
		tailor: ok,
		tailorOnboarding: ok,
		admin: 403,
		suspended: suspendedRedirect
	};
}

/**
 * A JSON read for the parties to a quote (the owner and the tailor who quoted) and admins; to other customers
 * and to tailors taking no part it does not exist.
 */
export function partiesApi(): Expectations {
	return {
		anonymous: 401,
		owner: 200,
		otherCustomer: 404,
		tailor: 200,
		tailorOnboarding: 404,
		admin: 200,
		suspended: 401
	};
}

const statusOf = (outcome: Outcome) => (typeof outcome === 'number' ? outcome : outcome.status);
const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
/** Whole tokens only: `91.4` must not be found inside `191.45`. */
const containing = (body: string, secret: string) => new RegExp(`(?<![\\w.])${escape(secret)}(?![\\w])`).test(body);

/** Defines one test per row and actor. `world` is read when the tests run (after `beforeAll`). */
export function describeMatrix(area: string, rows: Row[], world: () => World) {
	describe(`who may do what: ${area}`, () => {
		for (const row of rows) {
			it.each(actorNames)(`${row.name} as %s`, async (actor) => {
				const current = world();
				const arranged = await row.arrange(current);
				const response = await row.send(current.cast[actor].client, arranged);
				const expected = row.expect[actor];
				const body = await response.text();
				expect(response.status, `${row.name} as ${actor}: ${body.slice(0, 300)}`).toBe(statusOf(expected));
				if (typeof expected !== 'number') expect(response.headers.get('location')).toMatch(expected.location);
				const leaked = arranged.secrets.filter((secret) => containing(body, secret));
				if (actor === 'owner') {
					if (row.revealsToOwner) expect(leaked.length, 'the owner sees their own values').toBeGreaterThan(0);
				} else {
					expect(leaked, `${actor} must not receive the owner's private values`).toEqual([]);
				}
				if (actor !== 'owner' && row.unchanged && statusOf(expected) >= 300) await row.unchanged(current, arranged);
			});
		}
	});
}
