import { maxPageSize, maxRadiusKm, nearbyCommissionsQuery, nearbyWorkroomsQuery } from '../../search/schemas';
import { nearbyCommissionPage, nearbyWorkroomPage } from '../../search/response-schemas';
import { access, errors, jsonBody, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Search'];

/** Which store answered: the search index, or the database when the index is away. */
const source = {
	'x-search-source': {
		description:
			'`index` when the search index answered, `database` when it was unavailable and the database answered instead (same items, same order).',
		schema: { type: 'string' as const, enum: ['index', 'database'] }
	}
};

const paging = `Nearest first, at most ${maxPageSize} to a page; \`nextCursor\` fetches the next page (keep the other parameters). \`near\` is \`LAT,LNG\` in decimal degrees; \`radiusKm\` reaches at most ${maxRadiusKm} km.`;

const paths: Paths = {
	'/api/v1/commissions': {
		get: {
			operationId: 'searchCommissions',
			tags,
			summary: 'Find open commissions near you',
			...access(
				['tailor'],
				`Open commissions near a point: \`near\` if given, otherwise the workroom’s place, reaching its service radius unless \`radiusKm\` says otherwise (400 when the workroom has no place yet and \`near\` is left out). Filter by garment, budget, date needed, fabric source and words; \`sort=newest\` orders by publication instead. ${paging} Measurements are never shown here, only the size band.`
			),
			requestParams: { query: nearbyCommissionsQuery },
			responses: {
				'200': { ...jsonBody(nearbyCommissionPage, 'A page of open commissions.'), headers: source },
				...errors(400, 401, 403)
			}
		}
	},
	'/api/v1/tailors': {
		get: {
			operationId: 'searchTailors',
			tags,
			summary: 'Find workrooms near a point',
			...access(
				'public',
				`Workrooms whose onboarding is complete, near \`near\` within \`radiusKm\` (25 km unless given), optionally making a garment or matching words. Each says whether the point lies in its service area; the town is shown, never the workroom’s point. ${paging}`
			),
			requestParams: { query: nearbyWorkroomsQuery },
			responses: {
				'200': { ...jsonBody(nearbyWorkroomPage, 'A page of workrooms.'), headers: source },
				...errors(400)
			}
		}
	}
};

export const searchArea: Area = {
	tag: {
		name: 'Search',
		description:
			'Near-me lists: open commissions for tailors, workrooms for everyone. Answered from the search index, or from the database while the index is away.'
	},
	paths
};
