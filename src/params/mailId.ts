import type { ParamMatcher } from '@sveltejs/kit';

export const match = ((param: string) => /^[a-z0-9]+-[0-9]+$/.test(param)) satisfies ParamMatcher;
