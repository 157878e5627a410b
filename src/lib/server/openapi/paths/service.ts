import { z } from 'zod';
import { healthReportSchema } from '../../health/schemas';
import { access, errors, jsonBody, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Service'];

const paths: Paths = {
	'/api/v1/health': {
		get: {
			operationId: 'health',
			tags,
			summary: 'Is Tackline up?',
			...access(
				'public',
				'200 while the database answers (mail, jobs, storage or search may be degraded); 503 when it does not. Administrators also get error text in `details`.'
			),
			responses: {
				'200': jsonBody(healthReportSchema, 'Up, perhaps degraded.'),
				...errors(),
				'503': jsonBody(healthReportSchema, 'Down: the database does not answer.')
			}
		}
	},
	'/api/v1/openapi.json': {
		get: {
			operationId: 'openApiDocument',
			tags,
			summary: 'This API document',
			...access('public', 'OpenAPI 3.1, generated from the same zod schemas the endpoints validate with.'),
			responses: {
				'200': jsonBody(
					z.looseObject({ openapi: z.literal('3.1.0') }).meta({ description: 'An OpenAPI 3.1 document.' }),
					'The document.'
				),
				'304': { description: 'Not modified since the ETag sent in `If-None-Match`.' },
				...errors()
			}
		}
	}
};

export const serviceArea: Area = {
	tag: { name: 'Service', description: 'The state of the service and this description of it.' },
	paths
};
