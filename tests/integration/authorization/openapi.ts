/** The API's own description: public to everyone, whoever is signed in, and it carries nobody's data. */
import { everyone, type Row } from './matrix';

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
