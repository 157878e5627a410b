import type { ParamMatcher } from '@sveltejs/kit';
import { setupSections, type SetupSection } from '$lib/components/workrooms/sections';

export const match = ((param: string): param is SetupSection =>
	setupSections.some((section) => section.id === param)) satisfies ParamMatcher;
