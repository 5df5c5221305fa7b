/** The diagram's implied independencies ("claims") in words, one wording everywhere. */
import type { Claim } from '../causal';
import { listNames, type LabelOf } from './names';

/** "A is independent of B given C and D." */
export function claimSentence(c: Claim, labelOf: LabelOf): string {
	const a = labelOf(c.a);
	const b = labelOf(c.b);
	if (c.given === null) return untestableClaimSentence(a, b);
	if (c.given.length === 0) return `${a} is independent of ${b}.`;
	return `${a} is independent of ${b} given ${listNames(c.given.map(labelOf))}.`;
}

/** For a non-adjacent pair that no set of measured variables separates. */
export function untestableClaimSentence(a: string, b: string): string {
	return `${a} and ${b} are not adjacent, but no set of measured variables makes them independent.`;
}

/** "A ⟂ B | C, D": the compact form used in tables and the command line. */
export function claimText(c: { a: string; b: string; given: readonly string[] }, labelOf: LabelOf): string {
	return `${labelOf(c.a)} ⟂ ${labelOf(c.b)}${c.given.length ? ` | ${c.given.map(labelOf).join(', ')}` : ''}`;
}
