/**
 * The engine's façade in terms of variable ids: what the CLI prints and the app shows.
 * Each function validates the diagram and the question first and throws InputError with a
 * one-line message naming the problem; the index-based algorithms live beside this file.
 */
import type { Diagram } from '../graph/diagram';
import { compileDiagram, type CompiledDag } from '../graph/compiled';
import { InputError } from '../graph/errors';
import { DEFAULT_LISTED_PATHS, MAX_LISTED_PATHS } from '../limits';
import { validateDiagram, type DiagramIssue } from '../graph/validate';
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
import { variableRolesIdx } from './roles';
import { listMinimalAdjustmentSetsIdx, minimumAdjustmentSetIdx, optimalAdjustmentSetIdx } from './sets';

export interface QuestionOptions {
	exposures?: string[];
	outcomes?: string[];
}

export interface Prepared {
	g: CompiledDag;
	X: number[];
	Y: number[];
	exposures: string[];
	outcomes: string[];
}

/** Compares ids the same way everywhere (code-unit order, stable across machines). */
export function compareIds(a: string, b: string): number {
	return a < b ? -1 : a > b ? 1 : 0;
}

export function sortIds(ids: Iterable<string>): string[] {
	return [...ids].sort(compareIds);
}

/** Orders sets by size, then lexicographically by their sorted ids. */
export function compareSets(a: readonly string[], b: readonly string[]): number {
	if (a.length !== b.length) return a.length - b.length;
	for (let i = 0; i < a.length; i++) {
		const c = compareIds(a[i], b[i]);
		if (c !== 0) return c;
	}
	return 0;
}

/** Throws InputError for the first structural error (duplicate ids, unknown ends, cycles). */
function compileChecked(d: Diagram): CompiledDag {
	const errors = validateDiagram(d).filter((issue) => issue.code !== 'missing-exposure' && issue.code !== 'missing-outcome');
	const blocking = errors.filter((issue) => STRUCTURAL.has(issue.code));
	if (blocking.length > 0) throw new InputError(blocking[0].message);
	return compileDiagram(d);
}

const STRUCTURAL = new Set<DiagramIssue['code']>(['duplicate-id', 'unknown-arrow-end', 'self-loop', 'cycle']);

export function indicesFor(g: CompiledDag, ids: readonly string[], role: string): number[] {
	const seen = new Set<string>();
	const out: number[] = [];
	for (const id of ids) {
		const i = g.indexOf.get(id);
		if (i === undefined) throw new InputError(`The ${role} "${id}" is not a variable of the diagram`);
		if (seen.has(id)) continue;
		seen.add(id);
		out.push(i);
	}
	return out;
}

export function prepare(d: Diagram, opts: QuestionOptions = {}): Prepared {
	const g = compileChecked(d);
	const exposures = opts.exposures ?? d.exposures;
	const outcomes = opts.outcomes ?? d.outcomes;
	if (exposures.length === 0) throw new InputError('No exposure is chosen: name one (for example --exposure cycling)');
	if (outcomes.length === 0) throw new InputError('No outcome is chosen: name one (for example --outcome hypertension)');
	const X = indicesFor(g, exposures, 'exposure');
	const Y = indicesFor(g, outcomes, 'outcome');
	const both = exposures.find((id) => outcomes.includes(id));
	if (both !== undefined) throw new InputError(`"${both}" is both an exposure and an outcome`);
	return { g, X, Y, exposures: sortIds(new Set(exposures)), outcomes: sortIds(new Set(outcomes)) };
}

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
	return {
		exposures,
		outcomes,
		effect,
		identifiable: listing.identifiable,
		sets,
		truncated: listing.truncated,
		optimal: optimal && sortIds(named(g, optimal)),
		minimum: minimum && sortIds(named(g, minimum))
	};
}

/** The verdict on a planned set (the diagram's own `adjusted` unless given), with reasons. */
export function checkAdjustment(d: Diagram, opts: QuestionOptions & { adjusted?: string[]; maxPaths?: number } = {}): AdjustmentCheck {
	const { g, X, Y } = prepare(d, opts);
	const adjusted = opts.adjusted ?? d.adjusted;
	const Z = indicesFor(g, adjusted, 'adjusted variable');
	const result = checkAdjustmentIdx(g, X, Y, Z, opts.maxPaths ?? 50);
	return {
		adjusted: sortIds(new Set(adjusted)),
		valid: result.valid,
		problems: [
			...result.forbidden.map((f) => ({ kind: 'forbidden' as const, variable: g.ids[f.variable], why: f.why })),
			...result.openPaths.map((p) => ({ kind: 'open-path' as const, path: named(g, p) }))
		]
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

/** Roles of every variable for the question, in the diagram's order. */
export function variableRoles(d: Diagram, opts: QuestionOptions = {}): VariableRoles[] {
	const { g, X, Y } = prepare(d, opts);
	return variableRolesIdx(g, X, Y).map((roles, i) => ({ id: g.ids[i], roles }));
}

function reasonById(g: CompiledDag, r: NodeStatus): PathNodeReason {
	if (r.reason === 'collider-descendant-adjusted') return { node: g.ids[r.node], reason: r.reason, via: g.ids[r.via] };
	return { node: g.ids[r.node], reason: r.reason };
}

/** Every exposure–outcome path with its status under the planned set (capped). */
export function exposureOutcomePaths(d: Diagram, opts: QuestionOptions & { adjusted?: string[]; max?: number } = {}): PathListing {
	const { g, X, Y } = prepare(d, opts);
	const Z = indicesFor(g, opts.adjusted ?? d.adjusted, 'adjusted variable');
	const max = opts.max ?? DEFAULT_LISTED_PATHS;
	if (max > MAX_LISTED_PATHS) throw new InputError(`At most ${MAX_LISTED_PATHS} paths can be listed at once (asked for ${max})`);
	const listing = listPathsIdx(g, X, Y, Z, max);
	const paths: PathInfo[] = listing.paths.map((p) => ({
		nodes: named(g, p.nodes),
		causal: p.causal,
		open: p.open,
		reasons: p.reasons.map((r) => reasonById(g, r))
	}));
	return { paths, truncated: listing.truncated };
}

/** The independencies the diagram implies, one per non-adjacent pair of measured variables. */
export function impliedClaims(d: Diagram, opts: { max?: number } = {}): Claim[] {
	const g = compileChecked(d);
	return impliedClaimsIdx(g, opts.max).claims.map((c) => ({ a: g.ids[c.a], b: g.ids[c.b], given: c.given && sortIds(named(g, c.given)) }));
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
		check: checkAdjustment(d),
		roles: variableRoles(d),
		paths: exposureOutcomePaths(d, { max: opts.maxPaths }),
		claims
	};
}

// Reviewer tools (review of a stated set, robustness, efficiency, instruments, comparison).
export { reviewAdjustment, planRobustness, setsRobustToAdditions, efficiencyAdvice, conditionalInstruments, compareDiagrams } from './reviewer';
