import type { DraftResponse } from '$lib/drafting';

/** The awarded tailor's cutting draft as a page shows it; `working` while it is still being nested. */
export type AwardedDraft =
	| { ok: true; result: DraftResponse }
	| { ok: false; reason: 'no_template' | 'unavailable' | 'no_measurements' | 'working' };

/** What a page's load depends on for the draft: the page asks again while it is being worked out. */
export const awardedDraftDependency = 'tackline:awarded-draft';
