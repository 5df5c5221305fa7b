/** The diagram's implied independencies ("claims") in words. */
import type { Claim } from '../causal';
import { listNames, type LabelOf } from './names';

export function claimSentence(c: Claim, labelOf: LabelOf): string {
	const a = labelOf(c.a);
	const b = labelOf(c.b);
	if (c.given === null) return `${a} and ${b}: no independence that the measured variables could test.`;
	if (c.given.length === 0) return `${a} is independent of ${b}.`;
	return `${a} is independent of ${b} given ${listNames(c.given.map(labelOf))}.`;
}

/** "A ⟂ B | C, D": the compact form used in tables. */
export function claimText(c: { a: string; b: string; given: readonly string[] }, labelOf: LabelOf): string {
	return `${labelOf(c.a)} ⟂ ${labelOf(c.b)}${c.given.length ? ` | ${c.given.map(labelOf).join(', ')}` : ''}`;
}
