/** The people every authorisation row is tried as, each with a signed-in (or not) HTTP client. */
import { eq } from 'drizzle-orm';
import { expect } from 'vitest';
import type { Executor } from '../../../src/lib/server/db/client';
import { user } from '../../../src/lib/server/db/schema';
import { createUser, createWorkroom } from '../../factories';
import { newClient, signIn, type Client } from '../http';

export const actorNames = [
	'anonymous',
	'owner',
	'otherCustomer',
	'tailor',
	'tailorOnboarding',
	'admin',
	'suspended'
] as const;
export type ActorName = (typeof actorNames)[number];

export type Actor = { client: Client; id: string | null };
export type Cast = Record<ActorName, Actor>;

async function signedIn(person: { id: string; email: string; password: string }): Promise<Actor> {
	const client = newClient();
	const response = await signIn(client, person.email, person.password);
	expect(response.status, `sign-in of ${person.email}`).toBe(303);
	return { client, id: person.id };
}

/**
 * Everyone at once: a customer who owns the data under test, another customer, a tailor whose onboarding is
 * complete and one who has only started, an admin, and a customer suspended after signing in (their
 * cookie still arrives with every request; the session must not work).
 */
export async function castActors(db: Executor): Promise<Cast> {
	const [owner, otherCustomer, tailor, tailorOnboarding, admin, suspended] = await Promise.all([
		createUser(db, { name: 'Wenna Polglase' }),
		createUser(db, { name: 'Jory Trevail' }),
		createWorkroom(db),
		createWorkroom(db, { onboarded: false }),
		createUser(db, { role: 'admin' }),
		createUser(db, { name: 'Demelza Rowe' })
	]);
	const cast: Cast = {
		anonymous: { client: newClient(), id: null },
		owner: await signedIn(owner),
		otherCustomer: await signedIn(otherCustomer),
		tailor: await signedIn(tailor),
		tailorOnboarding: await signedIn(tailorOnboarding),
		admin: await signedIn(admin),
		suspended: await signedIn(suspended)
	};
	await db
		.update(user)
		.set({ suspendedAt: new Date(), suspendedReason: 'Suspended for the authorisation matrix' })
		.where(eq(user.id, suspended.id));
	return cast;
}
