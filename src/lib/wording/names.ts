/**
 * How variables, sets and paths are named in sentences: by their labels (the app, the report)
 * or by their ids (the command line: pass `idAsLabel`), joined as English lists. One spelling of
 * each thing everywhere: the empty set is "{ }", a path "A → B ← C". Pure functions; O(length).
 */
import type { Diagram } from '../graph/diagram';
import { groupThousands } from './numbers';

export type LabelOf = (id: string) => string;

/** True when the arrow a → b is in the diagram a path belongs to. */
export type ArrowTest = (a: string, b: string) => boolean;

/** The label of each id (the id itself when it has none). O(n) to build, O(1) per call. */
export function labelLookup(d: Diagram): LabelOf {
	const map = new Map(d.variables.map((v) => [v.id, v.label]));
	return (id) => map.get(id) ?? id;
}

/** Names variables by their ids: what the command line prints. */
export const idAsLabel: LabelOf = (id) => id;

/** "A", "A and B", "A, B and C". */
export function listNames(names: readonly string[]): string {
	if (names.length <= 1) return names.join('');
	return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** The one spelling of the empty set. */
export const EMPTY_SET = '{ }';

/** A set: "{Age, Diet quality}", or "{ }" when empty (sentences say what an empty set means). */
export function setText(ids: readonly string[], labelOf: LabelOf): string {
	return ids.length === 0 ? EMPTY_SET : `{${ids.map(labelOf).join(', ')}}`;
}

/** "adjusting for Age and Diet" or "adjusting for nothing". */
export function adjustingFor(ids: readonly string[], labelOf: LabelOf): string {
	return ids.length === 0 ? 'adjusting for nothing' : `adjusting for ${listNames(ids.map(labelOf))}`;
}

/**
 * The arrows of a diagram as a set of "from\0to" keys. O(m) once per arrow list: kept for the
 * list it was made from (the editor's diagrams are immutable snapshots; a list that grew is
 * read again), since every sentence about a path needs it and a verdict has up to 50 of them.
 */
export function arrowSet(d: Diagram): ReadonlySet<string> {
	const known = arrowSets.get(d.arrows);
	if (known && known.length === d.arrows.length) return known.set;
	const set = new Set(d.arrows.map((a) => `${a.from}\u0000${a.to}`));
	arrowSets.set(d.arrows, { length: d.arrows.length, set });
	return set;
}
const arrowSets = new WeakMap<readonly object[], { length: number; set: ReadonlySet<string> }>();

/** The arrow test of a list of arrows. O(m) to build, O(1) per call. */
export function arrowTest(arrows: readonly { from: string; to: string }[] | ReadonlySet<string>): ArrowTest {
	const keys = arrows instanceof Set ? (arrows as ReadonlySet<string>) : new Set((arrows as readonly { from: string; to: string }[]).map((a) => `${a.from}\u0000${a.to}`));
	return (a, b) => keys.has(`${a}\u0000${b}`);
}

/** "A → B ← C": the path with each arrow's real direction. O(length). */
export function pathWords(nodes: readonly string[], arrow: ArrowTest, labelOf: LabelOf): string {
	let text = labelOf(nodes[0] ?? '');
	for (let i = 1; i < nodes.length; i++) text += `${arrow(nodes[i - 1], nodes[i]) ? ' → ' : ' ← '}${labelOf(nodes[i])}`;
	return text;
}

/**
 * The noun in the number a count needs: "arrow" for 1, "arrows" for 0, 2 or 1.5. The one
 * plural rule of every sentence with a count; `many` for nouns without a plain "s"
 * ("strata"). O(1).
 */
export function plural(n: number, singular: string, many = `${singular}s`): string {
	return n === 1 ? singular : many;
}

/** "12 paths", "50+ claims" (the listing stopped, so more exist), "1 claim": a section's summary count. */
export function listedCountText(n: number, truncated: boolean, singular: string, many = `${singular}s`): string {
	return `${groupThousands(n)}${truncated ? '+' : ''} ${truncated ? many : plural(n, singular, many)}`;
}

/** "1 claim", "2 claims", "1,000 variables": a count with its noun in the right number. */
export function countText(n: number, singular: string, many = `${singular}s`): string {
	return `${groupThousands(n)} ${plural(n, singular, many)}`;
}
