import { createHash } from 'node:crypto';
import { buildDocument, type Area, type OpenApiDocument } from './registry';
import { docsView } from './view';
import { adminArea } from './paths/admin';
import { commissionsArea } from './paths/commissions';
import { draftingArea } from './paths/drafting';
import { fittingsArea } from './paths/fittings';
import { messagesArea } from './paths/messages';
import { notificationsArea } from './paths/notifications';
import { paymentsArea } from './paths/payments';
import { placesArea } from './paths/places';
import { profilesArea } from './paths/profiles';
import { quotesArea } from './paths/quotes';
import { searchArea } from './paths/search';
import { serviceArea } from './paths/service';
import { workroomsArea } from './paths/workrooms';

export { buildDocument, mergePaths, type Area, type OpenApiDocument } from './registry';
export { docsView } from './view';
export { apiErrorSchema, access, errors, jsonBody, jsonRequest, uuidPath } from './common';

/** Every area of `/api/v1`, in the order /api/docs shows them. Add a new area's module here. */
export const areas: readonly Area[] = [
	commissionsArea,
	quotesArea,
	paymentsArea,
	fittingsArea,
	messagesArea,
	notificationsArea,
	workroomsArea,
	searchArea,
	profilesArea,
	draftingArea,
	placesArea,
	adminArea,
	serviceArea
];

export const apiVersion = '1.0.0';

let built: { document: OpenApiDocument; body: string; etag: string } | null = null;
let view: ReturnType<typeof docsView> | null = null;

/** The document is made of code alone, so it is built once per process, on first use. */
export function openApi() {
	if (!built) {
		const document = buildDocument(areas, { version: apiVersion });
		const body = JSON.stringify(document);
		const etag = `"${createHash('sha256').update(body).digest('base64url').slice(0, 27)}"`;
		built = { document, body, etag };
	}
	return built;
}

/** What /api/docs shows, read from the same document. */
export function openApiDocsView() {
	return (view ??= docsView(openApi().document));
}
