import { createRequest, patchRequest } from '../../profiles/schemas';
import { profileListResponse, profileResponse } from '../../profiles/response-schemas';
import { access, errors, jsonBody, jsonRequest, uuidPath, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Measurement profiles'];
const id = uuidPath('id');
const checks =
	'Values are stored as sent; what the checks find (out of range, a suspected unit mix-up, an impossible relation) comes back in `checks`.';

const paths: Paths = {
	'/api/v1/measurement-profiles': {
		get: {
			operationId: 'listMeasurementProfiles',
			tags,
			summary: 'List your measurement profiles',
			...access(['customer'], 'One profile per person measured, lengths in each profile’s unit.'),
			responses: { '200': jsonBody(profileListResponse, 'Your profiles.'), ...errors(401, 403) }
		},
		post: {
			operationId: 'createMeasurementProfile',
			tags,
			summary: 'Make a measurement profile',
			...access(['customer'], `Lengths in the profile’s \`unit\`. ${checks} Labels are unique per account.`),
			requestBody: jsonRequest(createRequest),
			responses: {
				'201': jsonBody(profileResponse, 'The new profile; `Location` names it.'),
				...errors(400, 401, 403, 409, 413, 415)
			}
		}
	},
	'/api/v1/measurement-profiles/{id}': {
		get: {
			operationId: 'getMeasurementProfile',
			tags,
			summary: 'Read a measurement profile',
			...access(['customer'], 'Your own profiles only; others’ ids answer 404.'),
			requestParams: id,
			responses: { '200': jsonBody(profileResponse, 'The profile.'), ...errors(401, 403, 404) }
		},
		patch: {
			operationId: 'updateMeasurementProfile',
			tags,
			summary: 'Change a measurement profile',
			...access(
				['customer'],
				`Only the fields sent change. In \`values\`, the codes given are set (read in the unit after the change) and those sent as \`null\` removed. ${checks}`
			),
			requestParams: id,
			requestBody: jsonRequest(patchRequest),
			responses: { '200': jsonBody(profileResponse, 'The profile.'), ...errors(400, 401, 403, 404, 409, 413, 415) }
		},
		delete: {
			operationId: 'deleteMeasurementProfile',
			tags,
			summary: 'Delete a measurement profile',
			...access(['customer'], 'Commissions already published keep their frozen copy.'),
			requestParams: id,
			responses: { '204': { description: 'Deleted.' }, ...errors(401, 403, 404) }
		}
	}
};

export const profilesArea: Area = {
	tag: {
		name: 'Measurement profiles',
		description: 'A customer’s measurements, one profile per person, in centimetres or inches.'
	},
	paths
};
