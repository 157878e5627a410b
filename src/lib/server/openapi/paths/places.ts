import { placeListResponse, placesQuery } from '../../places/schemas';
import { access, errors, jsonBody, type Paths } from '../common';
import type { Area } from '../registry';

const paths: Paths = {
	'/api/v1/places': {
		get: {
			operationId: 'findPlaces',
			tags: ['Places'],
			summary: 'Find towns',
			...access(
				'public',
				'Towns by name (`q`, optionally within one `country`), or the town nearest a point (`near`). Give `q` or `near`. A place’s `id` is what `location.placeId` takes.'
			),
			requestParams: { query: placesQuery },
			responses: { '200': jsonBody(placeListResponse, 'Matching places, best first.'), ...errors(400) }
		}
	}
};

export const placesArea: Area = {
	tag: { name: 'Places', description: 'The gazetteer of towns and districts that locations are chosen from.' },
	paths
};
