/** What the analysis column asks the canvas to light up. */
export type Highlight =
	| { kind: 'path'; nodes: readonly string[]; style: 'causal' | 'open' | 'blocked' }
	| { kind: 'variables'; ids: readonly string[] };

export function sameHighlight(a: Highlight | null, b: Highlight | null): boolean {
	if (a === null || b === null) return a === b;
	if (a.kind === 'path' && b.kind === 'path') return a.style === b.style && a.nodes.join('\u0000') === b.nodes.join('\u0000');
	if (a.kind === 'variables' && b.kind === 'variables') return a.ids.join('\u0000') === b.ids.join('\u0000');
	return false;
}
