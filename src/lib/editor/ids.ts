/**
 * Variable ids for variables created in the editor.
 *
 * Ids are what files, the command line, data mappings and other programs refer to, so a
 * variable drawn in the app gets an id derived from its label ("Household income" →
 * "household_income") rather than an opaque counter, and then keeps it: renaming a variable
 * never changes its id (only the explicit "change id" command does, updating every
 * reference). Letters and digits of any script are kept (Unicode classes), so a label in any
 * language gives a readable id.
 */

/** Longest id made from a label: a readable handle, not a copy of a long label. */
export const MAX_GENERATED_ID = 60;

/**
 * Lower-cases a label and joins its runs of letters/digits with "_"; "variable" when none.
 * Cut at MAX_GENERATED_ID characters, at a "_" when there is one. O(length).
 */
export function slugify(label: string): string {
	let slug = label
		.normalize('NFKC')
		.toLowerCase()
		.split(/[^\p{L}\p{N}]+/u)
		.filter((part) => part.length > 0)
		.join('_');
	if (slug.length > MAX_GENERATED_ID) {
		const cut = [...slug].slice(0, MAX_GENERATED_ID).join('');
		const lastBreak = cut.lastIndexOf('_');
		slug = lastBreak > MAX_GENERATED_ID / 2 ? cut.slice(0, lastBreak) : cut;
	}
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
 * True when `id` looks generated from `label` (the slug, possibly with a numeric suffix). The
 * text view uses it to show ids that differ from their label's slug; the editor never renames
 * an id on its own.
 */
export function idFollowsLabel(id: string, label: string): boolean {
	const base = slugify(label);
	if (id === base) return true;
	return id.startsWith(`${base}_`) && /^\d+$/.test(id.slice(base.length + 1));
}

/**
 * The id change that turned `before` into `after`, if that is what happened: the same
 * variables in the same order, one of them with another id and its label unchanged (what
 * `change-id`, its undo and its redo do). Lets state kept outside the diagram, such as the
 * Review section's stated set, follow the id. O(n).
 */
export function idChangeBetween(before: { variables: readonly { id: string; label: string }[] }, after: { variables: readonly { id: string; label: string }[] }): { from: string; to: string } | null {
	if (before.variables.length !== after.variables.length) return null;
	let change: { from: string; to: string } | null = null;
	for (let i = 0; i < before.variables.length; i++) {
		const a = before.variables[i];
		const b = after.variables[i];
		if (a.id === b.id) continue;
		if (change !== null || a.label !== b.label) return null;
		change = { from: a.id, to: b.id };
	}
	return change;
}
