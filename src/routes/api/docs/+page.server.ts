import { openApiDocsView } from '$lib/server/openapi';
import type { PageServerLoad } from './$types';

// Made of code alone: built once as a file and sent to anyone without a session (server/public-pages.js).
export const prerender = 'auto';
// Links, anchors and native disclosure widgets only: the page needs no script.
export const csr = false;

export const load: PageServerLoad = () => ({ docs: openApiDocsView() });
