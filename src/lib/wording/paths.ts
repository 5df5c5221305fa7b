/** Exposure–outcome paths in words: the arrows' directions, causal or not, open or blocked and where. */
import type { PathInfo, PathNodeReason } from '../causal';
import type { Diagram } from '../graph/diagram';
import { arrowSet, listNames, type LabelOf } from './names';

/** "A → B ← C": the path with each arrow's real direction. */
export function pathText(nodes: readonly string[], d: Diagram, labelOf: LabelOf, arrows: ReadonlySet<string> = arrowSet(d)): string {
	let text = labelOf(nodes[0] ?? '');
	for (let i = 1; i < nodes.length; i++) {
		const forward = arrows.has(`${nodes[i - 1]}\u0000${nodes[i]}`);
		text += `${forward ? ' → ' : ' ← '}${labelOf(nodes[i])}`;
	}
	return text;
}

function reasonText(r: PathNodeReason, labelOf: LabelOf): string {
	switch (r.reason) {
		case 'adjusted-non-collider':
			return `${labelOf(r.node)} (adjusted for)`;
		case 'collider-not-adjusted':
			return `${labelOf(r.node)} (collider, not adjusted for)`;
		case 'collider-adjusted':
			return `${labelOf(r.node)} (collider, adjusted for)`;
		case 'collider-descendant-adjusted':
			return `${labelOf(r.node)} (collider, opened by adjusting for ${labelOf(r.via)})`;
	}
}

/** Whether a path is causal (directed from exposure to outcome) or not (a biasing path). */
export function pathKindLabel(p: PathInfo): 'causal' | 'biasing' {
	return p.causal ? 'causal' : 'biasing';
}

/** Open or blocked, and where: "open", "open through M (collider, adjusted for)", "blocked at A (adjusted for)". */
export function pathStatus(p: PathInfo, labelOf: LabelOf): string {
	if (p.open) {
		const opened = p.reasons.map((r) => reasonText(r, labelOf));
		return opened.length > 0 ? `open through ${listNames(opened)}` : 'open';
	}
	return `blocked at ${listNames(p.reasons.map((r) => reasonText(r, labelOf)))}`;
}

/** The visual kind of a path: causal (solid blue), open biasing (dashed vermillion) or blocked. */
export function pathKind(p: PathInfo): 'causal' | 'open' | 'blocked' {
	if (!p.open) return 'blocked';
	return p.causal ? 'causal' : 'open';
}

