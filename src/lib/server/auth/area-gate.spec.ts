import { isHttpError, isRedirect, type RequestEvent } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import type { SessionUser } from '$lib/types/user';
import { gateAreas, normalisedPath } from './area-gate';

function attempt(
	path: string,
	role: SessionUser['role'] | null,
	options: { method?: string; routeGuards?: boolean } = {}
) {
	const locals = {
		user: role ? { id: 'u1', name: 'Test', email: 't@example.test', role, units: 'cm' } : null,
		suspended: false,
		guarded: false
	} as App.Locals;
	const event = {
		url: new URL(`http://localhost${path}`),
		request: new Request(`http://localhost${path}`, { method: options.method ?? 'GET' }),
		locals
	} as unknown as RequestEvent;
	let reachedRoute = false;
	const resolve = () => {
		reachedRoute = true;
		if (options.routeGuards) locals.guarded = true;
		return new Response('page', { status: options.routeGuards ? 403 : 200 });
	};
	return Promise.resolve(gateAreas({ event, resolve })).then(
		(response: Response) => ({ response, reachedRoute, thrown: null as unknown }),
		(thrown: unknown) => ({ response: null, reachedRoute, thrown })
	);
}

describe('area gate', () => {
	it('lets each role into its own area and leaves other paths alone', async () => {
		expect((await attempt('/workroom/quotes', 'tailor')).response?.status).toBe(200);
		expect((await attempt('/draft-calculator', null)).response?.status).toBe(200);
		expect((await attempt('/workroomish', 'customer')).response?.status).toBe(200);
	});

	it('sends signed-out visitors to sign in', async () => {
		const { thrown } = await attempt('/desk', null);
		expect(isRedirect(thrown) && thrown.location).toBe('/sign-in?redirectTo=%2Fdesk');
	});

	it("keeps the route's own 403 page when the route guarded itself", async () => {
		const result = await attempt('/workroom', 'customer', { routeGuards: true });
		expect(result.response?.status).toBe(403);
	});

	it('refuses a response from a route that forgot its guard', async () => {
		const result = await attempt('/desk/ledger', 'customer');
		expect(result.reachedRoute).toBe(true);
		expect(isHttpError(result.thrown, 403)).toBe(true);
	});

	it("lets a tailor post a quote on a customer's commission, and nothing else there", async () => {
		const quotePage = '/commissions/0b6f3c56-8d3e-4f51-9a4e-6c1d2b7a9e10/quote';
		expect((await attempt(quotePage, 'tailor', { method: 'POST' })).response?.status).toBe(200);
		const byCustomer = await attempt(quotePage, 'customer', { method: 'POST', routeGuards: true });
		expect(isHttpError(byCustomer.thrown, 403)).toBe(true);
		const elsewhere = await attempt('/commissions/0b6f3c56-8d3e-4f51-9a4e-6c1d2b7a9e10', 'tailor', { method: 'POST' });
		expect(isHttpError(elsewhere.thrown, 403)).toBe(true);
	});

	it('never lets another role post into an area', async () => {
		const result = await attempt('/desk/users', 'tailor', { method: 'POST', routeGuards: true });
		expect(result.reachedRoute).toBe(false);
		expect(isHttpError(result.thrown, 403)).toBe(true);
	});

	it('reads every spelling of an area path as that area', async () => {
		for (const path of ['/%64esk', '/%64esk/users', '/Desk', '//desk', '/./desk', '/workroom/../desk', '/%2Fdesk']) {
			expect(normalisedPath(path), path).toMatch(/^\/desk(\/|$)/);
			const { thrown } = await attempt(path, 'tailor', { method: 'POST' });
			expect(isHttpError(thrown, 403), path).toBe(true);
		}
		expect(normalisedPath('/%E0%A4%A')).toBe('/%e0%a4%a');
	});
});
