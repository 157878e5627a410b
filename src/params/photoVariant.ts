import type { ParamMatcher } from '@sveltejs/kit';
import { photoVariants } from '$lib/types/photos';

export const match = ((param: string): param is (typeof photoVariants)[number] =>
	(photoVariants as readonly string[]).includes(param)) satisfies ParamMatcher;
