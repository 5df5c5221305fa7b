/**
 * Variable ids for variables created in the editor.
 *
 * Ids are what files, the command line and other programs refer to, so a variable drawn in
 * the app gets an id derived from its label ("Household income" → "household_income") rather
 * than an opaque counter. Letters and digits of any script are kept (Unicode classes), so a
 * label in any language gives a readable id.
 */

/** Lower-cases a label and joins its runs of letters/digits with "_"; "variable" when none. O(length). */
export function slugify(label: string): string {
	const slug = label
		.normalize('NFKC')
		.toLowerCase()
		.split(/[^\p{L}\p{N}]+/u)
		.filter((part) => part.length > 0)
		.join('_');
	return slug.length > 0 ? slug : 'variable';
}

/** `base` if not taken, else `base_2`, `base_3`, … (the first free one). O(k) set look-ups. */
export function uniqueId(base: string, taken: ReadonlySet<string>): string {
	if (!taken.has(base)) return base;
	for (let k = 2; ; k++) {
		const candidate = `${base}_${k}`;
		if (!taken.has(candidate)) return candidate;
	}
}

/**
 * True when `id` looks generated from `label` (the slug, possibly with a numeric suffix), so
 * that renaming the variable may rename its id too. Ids chosen by hand or read from a file
 * that do not follow the label are left alone.
 */
export function idFollowsLabel(id: string, label: string): boolean {
	const base = slugify(label);
	if (id === base) return true;
	return id.startsWith(`${base}_`) && /^\d+$/.test(id.slice(base.length + 1));
}
