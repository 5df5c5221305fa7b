/**
 * How variables and sets are named in sentences: by their labels, joined as English lists.
 * Pure functions; O(length of the list).
 */
import type { Diagram } from '../graph/diagram';

export type LabelOf = (id: string) => string;

export function labelLookup(d: Diagram): LabelOf {
	const map = new Map(d.variables.map((v) => [v.id, v.label]));
	return (id) => map.get(id) ?? id;
}

/** "A", "A and B", "A, B and C". */
export function listNames(names: readonly string[]): string {
	if (names.length <= 1) return names.join('');
	return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** A set as the app shows it: "{Age, Diet quality}", or "{ } (no adjustment)" when empty. */
export function setText(ids: readonly string[], labelOf: LabelOf): string {
	return ids.length === 0 ? '{ } (no adjustment)' : `{${ids.map(labelOf).join(', ')}}`;
}

/** The arrows of a diagram as a set of "from\0to" keys, for pathText. O(m). */
export function arrowSet(d: Diagram): ReadonlySet<string> {
	return new Set(d.arrows.map((a) => `${a.from}\u0000${a.to}`));
}

