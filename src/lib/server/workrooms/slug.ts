const uuidLike = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/** "Crème & Cut Ltd." → "creme-and-cut-ltd": lower-case ASCII words joined by hyphens, at most 60 characters. */
export function slugify(name: string): string {
	const slug = name
		.normalize('NFKD')
		.replace(/\p{M}/gu, '')
		.toLowerCase()
		.replace(/&/g, ' and ')
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+/, '')
		.slice(0, 60)
		.replace(/-+$/, '');
	// A slug never reads as a user id: the public page takes either.
	if (!slug || uuidLike.test(slug)) return slug ? `workroom-${slug}`.slice(0, 60) : 'workroom';
	return slug;
}

/** The first of `base`, `base-2`, `base-3`… that is not in `taken`. */
export function firstFreeSlug(base: string, taken: Iterable<string>): string {
	const used = new Set(taken);
	if (!used.has(base)) return base;
	for (let n = 2; ; n += 1) {
		const candidate = `${base}-${n}`;
		if (!used.has(candidate)) return candidate;
	}
}
