/** The API's own description: public to everyone, whoever is signed in, and it carries nobody's data. */
import type { Expectations, Row } from './matrix';

const everyone = (status: number): Expectations => ({
	anonymous: status,
	owner: status,
	otherCustomer: status,
	tailor: status,
	tailorOnboarding: status,
	admin: status,
	suspended: status
});

const nothing = () => Promise.resolve({ secrets: [] });

export const openApiRows: Row[] = [
	{
		name: 'GET /api/v1/openapi.json',
		arrange: nothing,
		send: (client) => client.json('GET', '/api/v1/openapi.json'),
		expect: everyone(200)
	},
	{
		name: 'GET /api/docs',
		arrange: nothing,
		send: (client) => client.get('/api/docs'),
		expect: everyone(200)
	}
];
