/**
 * The engine's façade in terms of variable ids: what the CLI prints and the app shows.
 * Each function validates the diagram and the question first and throws InputError with a
 * one-line message naming the problem; the index-based algorithms live beside this file.
 */
import type { Diagram } from '../graph/diagram';
import type { CompiledDag } from '../graph/compiled';
import { InputError } from '../graph/errors';
import { DEFAULT_LISTED_PATHS, MAX_LISTED_PATHS } from '../limits';
import { validateDiagram, type DiagramIssue } from '../graph/validate';
import { compareSets, compileChecked, indicesFor, prepare, sortIds, STRUCTURAL, type QuestionOptions } from './question';
import type {
	AdjustmentCheck,
	AdjustmentSets,
	Claim,
	DSeparationResult,
	Effect,
	PathInfo,
	PathListing,
	PathNodeReason,
	VariableRoles
} from './types';
import { checkAdjustmentIdx } from './adjustment';
import { impliedClaimsIdx } from './claims';
import { dSeparated } from './dsep';
import { listPathsIdx, type NodeStatus } from './paths';
import { openNonCausalPathsIdx, type OpenNonCausalListing } from './open-paths';
import { variableRoleDetailsIdx } from './roles';
import { listMinimalAdjustmentSetsIdx, minimumAdjustmentSetIdx, optimalAdjustmentSetIdx, optimalSetGapIdx } from './sets';

const named = (g: CompiledDag, list: readonly number[]) => list.map((i) => g.ids[i]);

/** Every minimal sufficient adjustment set, with the minimum and optimal sets. */
export function adjustmentSets(d: Diagram, opts: QuestionOptions & { effect?: Effect; max?: number } = {}): AdjustmentSets {
	const { g, X, Y, exposures, outcomes } = prepare(d, opts);
	const effect = opts.effect ?? 'total';
	if (effect === 'direct' && (X.length !== 1 || Y.length !== 1)) {
		throw new InputError('The direct effect needs exactly one exposure and one outcome');
	}
	const listing = listMinimalAdjustmentSetsIdx(g, X, Y, { effect, max: opts.max });
	const sets = listing.sets.map((s) => sortIds(named(g, s))).sort(compareSets);
	const minimum = listing.identifiable ? minimumAdjustmentSetIdx(g, X, Y, effect) : null;
	const optimal = effect === 'total' && listing.identifiable ? optimalAdjustmentSetIdx(g, X, Y) : null;
	const gap = effect === 'total' ? optimalSetGapIdx(g, X, Y, listing.identifiable) : null;
	return {
		exposures,
		outcomes,
		effect,
		identifiable: listing.identifiable,
		sets,
		truncated: listing.truncated,
		optimal: optimal && sortIds(named(g, optimal)),
		minimum: minimum && sortIds(named(g, minimum)),
		...(gap ? { optimalGap: gap.why === 'unmeasured' ? { why: 'unmeasured' as const, unmeasured: sortIds(named(g, gap.unmeasured)) } : { why: gap.why } } : {})
	};
}

/** The verdict on a planned set (the diagram's own `adjusted` unless given), with reasons. */
export function checkAdjustment(d: Diagram, opts: QuestionOptions & { adjusted?: string[]; maxPaths?: number } = {}): AdjustmentCheck {
	const { g, X, Y } = prepare(d, opts);
	const adjusted = opts.adjusted ?? d.adjusted;
	return checkById(g, X, Y, adjusted, indicesFor(g, adjusted, 'adjusted variable'), opts.maxPaths ?? 50);
}

function checkById(
	g: CompiledDag,
	X: readonly number[],
	Y: readonly number[],
	adjusted: readonly string[],
	Z: readonly number[],
	maxPaths: number,
	open?: OpenNonCausalListing
): AdjustmentCheck {
	const result = checkAdjustmentIdx(g, X, Y, Z, maxPaths, open);
	return {
		adjusted: sortIds(new Set(adjusted)),
		valid: result.valid,
		problems: [
			...result.forbidden.map((f) => ({ kind: 'forbidden' as const, variable: g.ids[f.variable], why: f.why })),
			...result.openPaths.map((p) => ({ kind: 'open-path' as const, path: named(g, p) }))
		],
		openPaths: result.openPathCount
	};
}

/** d-separation of two sets of variables given a third. */
export function dSeparation(d: Diagram, from: readonly string[], to: readonly string[], given: readonly string[] = []): DSeparationResult {
	const g = compileChecked(d);
	const A = indicesFor(g, from, 'variable');
	const B = indicesFor(g, to, 'variable');
	const C = indicesFor(g, given, 'variable');
	if (A.length === 0 || B.length === 0) throw new InputError('d-separation needs at least one variable on each side');
	const overlap = [A, B, C].flat().find((v, i, all) => all.indexOf(v) !== i);
	if (overlap !== undefined) throw new InputError(`"${g.ids[overlap]}" appears in more than one of the sets`);
	const r = dSeparated(g, A, B, C);
	return { separated: r.separated, path: r.path && named(g, r.path) };
}

/** Roles of every variable for the question, in the diagram's order (or of the `only` ones, in their order). */
export function variableRoles(d: Diagram, opts: QuestionOptions & { only?: readonly string[] } = {}): VariableRoles[] {
	const { g, X, Y } = prepare(d, opts);
	const only = opts.only && indicesFor(g, opts.only, 'variable');
	return variableRoleDetailsIdx(g, X, Y, only).map((r, i) => {
		const out: VariableRoles = { id: g.ids[only ? only[i] : i], roles: r.roles };
		if (r.adjustWith !== null) out.adjustWith = sortIds(r.adjustWith.map((w) => g.ids[w]));
		if (r.undecided) out.confounderUndecided = true;
		return out;
	});
}

function reasonById(g: CompiledDag, r: NodeStatus): PathNodeReason {
	if (r.reason === 'collider-descendant-adjusted') return { node: g.ids[r.node], reason: r.reason, via: g.ids[r.via] };
	return { node: g.ids[r.node], reason: r.reason };
}

/** Every exposure–outcome path with its status under the planned set (capped). */
export function exposureOutcomePaths(d: Diagram, opts: QuestionOptions & { adjusted?: string[]; max?: number } = {}): PathListing {
	const { g, X, Y } = prepare(d, opts);
	const Z = indicesFor(g, opts.adjusted ?? d.adjusted, 'adjusted variable');
	return pathsById(g, X, Y, Z, listedPaths(opts.max));
}

function listedPaths(asked: number | undefined): number {
	const max = asked ?? DEFAULT_LISTED_PATHS;
	if (max > MAX_LISTED_PATHS) throw new InputError(`At most ${MAX_LISTED_PATHS} paths can be listed at once (asked for ${max})`);
	return max;
}

function pathsById(g: CompiledDag, X: readonly number[], Y: readonly number[], Z: readonly number[], max: number, open?: OpenNonCausalListing): PathListing {
	const listing = listPathsIdx(g, X, Y, Z, max, undefined, open);
	const paths: PathInfo[] = listing.paths.map((p) => ({
		nodes: named(g, p.nodes),
		causal: p.causal,
		open: p.open,
		reasons: p.reasons.map((r) => reasonById(g, r))
	}));
	return { paths, truncated: listing.truncated, openNonCausal: listing.openNonCausal };
}

/**
 * The verdict on the diagram's planned set and the path listing together, from one search for
 * the open non-causal paths: the Adjustment and Paths sections' counts come from one answer.
 */
export function checkAndPaths(
	d: Diagram,
	opts: QuestionOptions & { maxPaths?: number; maxProblemPaths?: number } = {}
): { check: AdjustmentCheck; paths: PathListing } {
	const max = listedPaths(opts.maxPaths);
	const maxProblemPaths = opts.maxProblemPaths ?? 50;
	const { g, X, Y, Z, open } = openPathsOfPlan(d, opts, d.adjusted, { keep: Math.max(max, maxProblemPaths) });
	return { check: checkById(g, X, Y, d.adjusted, Z, maxProblemPaths, open), paths: pathsById(g, X, Y, Z, max, open) };
}

/**
 * The verdict on the planned set alone, before the open non-causal paths are counted: the
 * search stops after the first `maxProblemPaths` of them, so the count is exact only when it is
 * below that (bound 'more-than' otherwise). Valid or not is the same answer as checkAndPaths'
 * (both rest on the adjustment criterion); the app shows this at once and the exact count and
 * the listing from checkAndPaths when they follow. O(n + m) plus maxProblemPaths path delays.
 */
export function checkFirst(d: Diagram, opts: QuestionOptions & { adjusted?: string[]; maxProblemPaths?: number } = {}): AdjustmentCheck {
	const adjusted = opts.adjusted ?? d.adjusted;
	const maxProblemPaths = opts.maxProblemPaths ?? 50;
	const { g, X, Y, Z, open } = openPathsOfPlan(d, opts, adjusted, { keep: maxProblemPaths, countCap: maxProblemPaths });
	return checkById(g, X, Y, adjusted, Z, maxProblemPaths, open);
}

/** The question in indices and its open non-causal paths under `adjusted` (exposure and outcome left out of Z). */
function openPathsOfPlan(d: Diagram, opts: QuestionOptions, adjusted: readonly string[], search: { keep: number; countCap?: number }) {
	const { g, X, Y } = prepare(d, opts);
	const Z = indicesFor(g, adjusted, 'adjusted variable');
	const ends = new Set([...X, ...Y]);
	return { g, X, Y, Z, open: openNonCausalPathsIdx(g, X, Y, Z.filter((z) => !ends.has(z)), search) };
}

/** The independencies the diagram implies, one per non-adjacent pair of measured variables. */
export function impliedClaims(d: Diagram, opts: { max?: number } = {}): Claim[] {
	return listImpliedClaims(d, opts).claims;
}

/**
 * The implied claims with whether the listing stopped at `max`, reporting progress (fraction
 * of pairs done) for long listings. Empty when the diagram is not a DAG (the caller shows the
 * diagram's problems instead). O(n²) pairs, each O(|An(a, b)| + arrows in it).
 */
export function listImpliedClaims(
	d: Diagram,
	opts: { max?: number; progress?: (fraction: number) => void; every?: number } = {}
): { claims: Claim[]; truncated: boolean } {
	if (validateDiagram(d).some((i) => STRUCTURAL.has(i.code))) return { claims: [], truncated: false };
	const g = compileChecked(d);
	const listing = impliedClaimsIdx(g, opts.max, opts.progress, opts.every);
	return {
		claims: listing.claims.map((c) => ({ a: g.ids[c.a], b: g.ids[c.b], given: c.given && sortIds(named(g, c.given)) })),
		truncated: listing.truncated
	};
}

export interface Analysis {
	issues: DiagramIssue[];
	/** Acyclic, consistent, with an exposure and an outcome: the rest is filled in. */
	ready: boolean;
	sets: AdjustmentSets | null;
	directSets: AdjustmentSets | null;
	check: AdjustmentCheck | null;
	roles: VariableRoles[];
	paths: PathListing | null;
	claims: Claim[];
}

/** Everything the app shows for a diagram at once. */
export function analyse(d: Diagram, opts: { maxSets?: number; maxPaths?: number; maxClaims?: number } = {}): Analysis {
	const issues = validateDiagram(d, { needQuestion: true });
	const structural = issues.some((i) => STRUCTURAL.has(i.code));
	const claims = structural ? [] : impliedClaims(d, { max: opts.maxClaims });
	const ready = issues.length === 0;
	if (!ready) return { issues, ready, sets: null, directSets: null, check: null, roles: [], paths: null, claims };
	const direct = d.exposures.length === 1 && d.outcomes.length === 1;
	return {
		issues,
		ready,
		sets: adjustmentSets(d, { max: opts.maxSets }),
		directSets: direct ? adjustmentSets(d, { effect: 'direct', max: opts.maxSets }) : null,
		...checkAndPaths(d, { maxPaths: opts.maxPaths }),
		roles: variableRoles(d),
		claims
	};
}
