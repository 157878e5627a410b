/**
 * The books: escrow totals, the reconciliation and the orders that do not balance are for administrators only.
 * The answer to everyone else says nothing about the money (no totals, no order ids).
 */
import { signInRedirect, suspendedRedirect, type Expectations, type Row } from './matrix';

const nothing = () => Promise.resolve({ secrets: [] });

function adminApi(): Expectations {
	return {
		anonymous: 401,
		owner: 403,
		otherCustomer: 403,
		tailor: 403,
		tailorOnboarding: 403,
		admin: 200,
		suspended: 401
	};
}

function adminPage(): Expectations {
	return {
		anonymous: signInRedirect,
		owner: 403,
		otherCustomer: 403,
		tailor: 403,
		tailorOnboarding: 403,
		admin: 200,
		suspended: suspendedRedirect
	};
}

export const escrowRows: Row[] = [
	{
		name: 'GET /api/v1/admin/escrow',
		arrange: nothing,
		send: (client) => client.json('GET', '/api/v1/admin/escrow'),
		expect: adminApi()
	},
	{
		name: 'GET /desk/escrow',
		arrange: nothing,
		send: (client) => client.get('/desk/escrow'),
		expect: adminPage()
	},
	{
		name: 'GET /desk/escrow?from=25',
		arrange: nothing,
		send: (client) => client.get('/desk/escrow?from=25'),
		expect: adminPage()
	}
];
