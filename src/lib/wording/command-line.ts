/**
 * The command line's plain-text forms of the shared sentences: variables are named by their
 * ids (pipelines match on them), everything else is worded as in the app and the report.
 */
import type { AdjustmentProblem, PathInfo, PathNodeReason } from '../causal';
import { FORBIDDEN_WHY } from './adjustment';
import { idAsLabel, pathWords, setText, type ArrowTest } from './names';
import { nodeReasonText, pathKindWords, pathStatus } from './paths';
import { ROLE_NAME } from './roles';

/** A set of ids: "{a, b}", or "{ }" when empty. */
export const braces = (ids: readonly string[]): string => setText(ids, idAsLabel);

/** "a → b ← c" (or "a – b – c" when the arrows are not known). */
export function pathText(nodes: readonly string[], arrows?: ArrowTest): string {
	return arrows ? pathWords(nodes, arrows, idAsLabel) : nodes.join(' – ');
}

export function problemText(p: AdjustmentProblem, arrows: ArrowTest): string {
	if (p.kind === 'forbidden') return `${p.variable} ${FORBIDDEN_WHY[p.why]}`;
	return `open non-causal path: ${pathText(p.path, arrows)}`;
}

export const ROLE_TEXT = ROLE_NAME;

export function reasonText(r: PathNodeReason): string {
	return nodeReasonText(r, idAsLabel);
}

/** "a → b ← c   [back-door path, open through …]": one line of `paths`. */
export function pathLine(p: PathInfo, arrows: ArrowTest): string {
	return `${pathText(p.nodes, arrows)}   [${pathKindWords(p, arrows)}, ${pathStatus(p, idAsLabel)}]`;
}
