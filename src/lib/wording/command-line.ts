/**
 * The command line's plain-text forms of the shared sentences: variables are named by their
 * ids (pipelines match on them), everything else is worded as in the app and the report.
 */
import type { AdjustmentProblem, Claim, PathInfo, PathNodeReason } from '../causal';
import { FORBIDDEN_WHY } from './adjustment';
import { claimText, untestableClaimSentence } from './claims';
import { countText, idAsLabel, pathWords, setText, type ArrowTest } from './names';
import { groupThousands } from './numbers';
import { nodeReasonText, pathKindWords, pathStatus } from './paths';
import { ROLE_NAME } from './roles';

/** A set of ids: "{a, b}", or "{ }" when empty. */
export const braces = (ids: readonly string[]): string => setText(ids, idAsLabel);

/** "a → b ← c" (or "a – b – c" when the arrows are not known). */
export function pathText(nodes: readonly string[], arrows?: ArrowTest): string {
	return arrows ? pathWords(nodes, arrows, idAsLabel) : nodes.join(' – ');
}

/**
 * One problem of a planned set: "m is a mediator …", or "open back-door path: x ← c → y" (a
 * back-door path when it starts with an arrow into the exposure, else a non-causal path, as
 * the app and the other views name it).
 */
export function problemText(p: AdjustmentProblem, arrows: ArrowTest): string {
	if (p.kind === 'forbidden') return `${p.variable} ${FORBIDDEN_WHY[p.why]}`;
	return `open ${pathKindWords({ nodes: p.path, causal: false }, arrows)}: ${pathText(p.path, arrows)}`;
}

/**
 * `causeway review verdict` in text: "Adjusting for {a, b} is sufficient to estimate the
 * total effect." or "… is NOT sufficient …:" followed by one "  - " line per problem. O(total
 * path length).
 */
export function quickVerdictLines(check: { adjusted: readonly string[]; valid: boolean; problems: readonly AdjustmentProblem[] }, arrows: ArrowTest): string[] {
	const head = `Adjusting for ${braces(check.adjusted)} ${check.valid ? 'is sufficient to estimate the total effect.' : 'is NOT sufficient to estimate the total effect:'}`;
	return [head, ...check.problems.map((p) => `  - ${problemText(p, arrows)}`)];
}

/** "Note: …" under a verdict (e.g. an exposure marked unmeasured). */
export const noteLine = (note: string): string => `Note: ${note}`;

export const ROLE_TEXT = ROLE_NAME;

export function reasonText(r: PathNodeReason): string {
	return nodeReasonText(r, idAsLabel);
}

/** "a → b ← c   [back-door path, open through …]": one line of `paths`. */
export function pathLine(p: PathInfo, arrows: ArrowTest): string {
	return `${pathText(p.nodes, arrows)}   [${pathKindWords(p, arrows)}, ${pathStatus(p, idAsLabel)}]`;
}

/** `causeway diagram separation`: "{a} and {c} are d-separated given {e}." or d-connected, with one open path. */
export function separationLine(from: readonly string[], to: readonly string[], given: readonly string[], path: readonly string[] | null, arrows: ArrowTest): string {
	const condition = given.length ? braces(given) : 'nothing';
	if (path === null) return `${braces(from)} and ${braces(to)} are d-separated given ${condition}.`;
	return `${braces(from)} and ${braces(to)} are d-connected given ${condition}; open path: ${pathText(path, arrows)}`;
}

/** `causeway diagram claims`: one line per claim, "a ⟂ b | c" or the sentence for a pair nothing separates. */
export function claimLine(c: Claim): string {
	return c.given === null ? untestableClaimSentence(c.a, c.b) : claimText({ a: c.a, b: c.b, given: c.given }, idAsLabel);
}
export const NO_CLAIMS = 'The diagram implies no independence between measured variables.';

/** "… stopped after 1 path (--max); more exist": a listing cut at its cap. */
export function stoppedLine(count: number, noun: string, cap: string): string {
	return `… stopped after ${countText(count, noun)} (${cap}); more exist`;
}

/** `causeway plan sets`: the header above the listing, or why there is nothing to list. */
export function setsHeader(r: { effect: string; exposures: readonly string[]; outcomes: readonly string[]; identifiable: boolean }, max: number): string {
	const what = `${r.effect} effect of ${r.exposures.join(', ')} on ${r.outcomes.join(', ')}`;
	if (!r.identifiable) return `The ${what} cannot be identified by adjustment: no set of measured variables is sufficient.`;
	return `Minimal sufficient adjustment sets for the ${what} (at most ${groupThousands(max)} listed; --max N to change):`;
}

export const NO_PATH = 'No path joins the exposure and the outcome.';
