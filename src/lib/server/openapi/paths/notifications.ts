import { listQuery, preferencesBody, readBody } from '../../notifications/schemas';
import { notificationPage, preferencesResponse, readResponse } from '../../notifications/response-schemas';
import { access, errors, jsonBody, jsonRequest, type Paths } from '../common';
import type { Area } from '../registry';

const tags = ['Notifications'];

const paths: Paths = {
	'/api/v1/notifications': {
		get: {
			operationId: 'listNotifications',
			tags,
			summary: 'List the caller’s notices',
			...access(
				'signedIn',
				'The caller’s in-app notices, newest first, with how many are unread; `nextCursor` fetches the older page.'
			),
			requestParams: { query: listQuery },
			responses: { '200': jsonBody(notificationPage, 'A page of notices.'), ...errors(400, 401) }
		}
	},
	'/api/v1/notifications/read': {
		post: {
			operationId: 'markNotificationsRead',
			tags,
			summary: 'Mark notices read',
			...access(
				'signedIn',
				'Marks the caller’s notices read: those in `ids` (ids of other people’s notices change nothing), or every one with `all: true`.'
			),
			requestBody: jsonRequest(readBody),
			responses: {
				'200': jsonBody(readResponse, 'How many were marked, and how many stay unread.'),
				...errors(400, 401, 413, 415)
			}
		}
	},
	'/api/v1/account/notification-preferences': {
		get: {
			operationId: 'getNotificationPreferences',
			tags,
			summary: 'Read notification preferences',
			...access(
				'signedIn',
				'Every event the caller’s account can receive, with whether it is mailed and shown in the app. Events about money or meetings are always sent (`required`).'
			),
			responses: { '200': jsonBody(preferencesResponse, 'The preferences.'), ...errors(401) }
		},
		put: {
			operationId: 'setNotificationPreferences',
			tags,
			summary: 'Change notification preferences',
			...access(
				'signedIn',
				'Turns channels on or off per event; a channel left out keeps its setting. Turning off an event that is always sent, or naming one the account never receives, answers 422 `always_sent` and saves nothing.'
			),
			requestBody: jsonRequest(preferencesBody),
			responses: {
				'200': jsonBody(preferencesResponse, 'The preferences after the change.'),
				...errors(400, 401, 413, 415, 422)
			}
		}
	}
};

export const notificationsArea: Area = {
	tag: {
		name: 'Notifications',
		description:
			'In-app notices (what happened, and where to look) and the caller’s choice of which events reach them by mail and in the app.'
	},
	paths
};
