/**
 * Exposure–outcome paths in words: the arrows' directions, causal or not, open or blocked and
 * where. One vocabulary (DESIGN.md): a "non-causal path" is open or blocked under the planned
 * set; "back-door path" is said only of a non-causal path that starts with an arrow into the
 * exposure (Pearl 1995). Shared by the app, the command line and the report.
 */
import type { PathCount, PathInfo, PathNodeReason } from '../causal';
import type { Diagram } from '../graph/diagram';
import { groupThousands } from './numbers';
import { arrowSet, arrowTest, countText, listNames, pathWords, type ArrowTest, type LabelOf } from './names';

/** "A → B ← C": the path with each arrow's real direction. */
export function pathText(nodes: readonly string[], d: Diagram, labelOf: LabelOf, arrows: ReadonlySet<string> = arrowSet(d)): string {
	return pathWords(nodes, arrowTest(arrows), labelOf);
}

/** Why a variable on a path blocks it or holds it open, after the variable's name. */
export function nodeReasonText(r: PathNodeReason, labelOf: LabelOf): string {
	switch (r.reason) {
		case 'adjusted-non-collider':
			return `${labelOf(r.node)} (adjusted for, not a collider)`;
		case 'collider-not-adjusted':
			return `${labelOf(r.node)} (a collider; neither it nor a descendant adjusted for)`;
		case 'collider-adjusted':
			return `${labelOf(r.node)} (a collider, adjusted for)`;
		case 'collider-descendant-adjusted':
			return `${labelOf(r.node)} (a collider whose descendant ${labelOf(r.via)} is adjusted for)`;
	}
}

/** Whether a path is causal (directed from exposure to outcome) or not. */
export function pathKindLabel(p: PathInfo): 'causal' | 'non-causal' {
	return p.causal ? 'causal' : 'non-causal';
}

/** True when a path starts with an arrow into its first variable (the exposure). */
export function isBackDoor(nodes: readonly string[], arrow: ArrowTest): boolean {
	return nodes.length > 1 && arrow(nodes[1], nodes[0]);
}

/** "causal path", "back-door path" or "non-causal path". */
export function pathKindWords(p: Pick<PathInfo, 'nodes' | 'causal'>, arrow: ArrowTest): string {
	if (p.causal) return 'causal path';
	return isBackDoor(p.nodes, arrow) ? 'back-door path' : 'non-causal path';
}

/** Open or blocked, and where: "open", "open through M (a collider, adjusted for)", "blocked at A (adjusted for, not a collider)". */
export function pathStatus(p: PathInfo, labelOf: LabelOf): string {
	if (p.open) {
		const opened = p.reasons.map((r) => nodeReasonText(r, labelOf));
		return opened.length > 0 ? `open through ${listNames(opened)}` : 'open';
	}
	return `blocked at ${listNames(p.reasons.map((r) => nodeReasonText(r, labelOf)))}`;
}

/** The visual kind of a path: causal (solid blue), open non-causal (dashed vermillion) or blocked. */
export function pathKind(p: PathInfo): 'causal' | 'open' | 'blocked' {
	if (!p.open) return 'blocked';
	return p.causal ? 'causal' : 'open';
}

/**
 * "3 open non-causal paths", "more than 10,000 …", "at least 40 …" (`what` names the paths).
 * The app's Paths and Adjustment sections and the command line say counts this one way.
 */
export function pathCountText(c: PathCount, what = 'open non-causal path'): string {
	const plain = countText(c.count, what);
	if (c.bound === 'more-than') return `more than ${plain}`;
	if (c.bound === 'at-least') return `at least ${plain}`;
	return plain;
}

/** The number alone: "50", "more than 10,000", "at least 40". */
export function countBoundText(c: PathCount): string {
	const n = groupThousands(c.count);
	return c.bound === 'more-than' ? `more than ${n}` : c.bound === 'at-least' ? `at least ${n}` : n;
}

/** "50 open non-causal paths under the planned set." — one sentence for the app and the command line. */
export function pathCountSentence(c: PathCount): string {
	const text = pathCountText(c);
	return `${text[0].toUpperCase()}${text.slice(1)} under the planned set.`;
}
