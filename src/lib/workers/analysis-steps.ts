/**
 * The app's analysis, run in steps so that a caller can report progress and show partial
 * results: first the question-dependent results (sets, verdict, roles, paths — milliseconds
 * even at 300 variables), then the implied claims, which take O(n² (n + Σ indeg²)) time and
 * dominate on large diagrams (about 2 s at 300 variables on one core).
 *
 * The result equals the engine façade's `analyse` (tests/unit/editor/analysis-steps.test.ts
 * holds it to that). Pure TypeScript: runs in the worker and, for small diagrams, on the main thread.
 */
import type { Diagram } from '../graph/diagram';
import { validateDiagram } from '../graph/validate';
import {
	adjustmentSets,
	checkAdjustment,
	exposureOutcomePaths,
	listImpliedClaims,
	variableRoles,
	type Analysis,
	type Claim
} from '../causal';

export interface AnalysisLimits {
	maxSets: number;
	maxPaths: number;
	maxClaims: number;
}

export const DEFAULT_LIMITS: AnalysisLimits = { maxSets: 200, maxPaths: 500, maxClaims: 20_000 };

export interface AnalysisProgress {
	/** What is being computed, for the progress line. */
	stage: string;
	/** 0..1 */
	fraction: number;
}

/** Everything `analyse` returns, plus whether the claims were cut at the limit. */
export interface AppAnalysis extends Analysis {
	claimsTruncated: boolean;
	/** False while the claims are still being listed (a partial result). */
	complete: boolean;
}

/** The question-dependent part (sets, verdict, roles, paths); claims left empty. */
export function analyseQuestion(d: Diagram, limits: AnalysisLimits = DEFAULT_LIMITS): AppAnalysis {
	const issues = validateDiagram(d, { needQuestion: true });
	const base = { issues, claims: [] as Claim[], claimsTruncated: false, complete: false };
	if (issues.length > 0) return { ...base, ready: false, sets: null, directSets: null, check: null, roles: [], paths: null };
	const direct = d.exposures.length === 1 && d.outcomes.length === 1;
	return {
		...base,
		ready: true,
		sets: adjustmentSets(d, { max: limits.maxSets }),
		directSets: direct ? adjustmentSets(d, { effect: 'direct', max: limits.maxSets }) : null,
		check: checkAdjustment(d),
		roles: variableRoles(d),
		paths: exposureOutcomePaths(d, { max: limits.maxPaths })
	};
}

/**
 * The implied claims (one per non-adjacent pair of measured variables, in index order, as
 * `impliedClaims` lists them), calling `progress` with the fraction of pairs done about every
 * `every` pairs. Empty when the diagram is not a DAG.
 */
export function listClaims(
	d: Diagram,
	maxClaims: number,
	progress?: (fraction: number) => void,
	every = 250
): { claims: Claim[]; truncated: boolean } {
	return listImpliedClaims(d, { max: maxClaims, progress, every });
}

/**
 * Runs both steps, reporting progress and the partial result after the first one.
 * With `knownClaims` (from an earlier run on a diagram with the same claimsKey) the second
 * step is skipped: the claims depend only on the variables, arrows and what is measured.
 */
export function runAnalysis(
	d: Diagram,
	limits: AnalysisLimits = DEFAULT_LIMITS,
	report?: (p: AnalysisProgress, partial: AppAnalysis | null) => void,
	knownClaims?: { claims: Claim[]; truncated: boolean }
): AppAnalysis {
	report?.({ stage: 'Adjustment sets, verdict, roles and paths', fraction: 0 }, null);
	const question = analyseQuestion(d, limits);
	if (knownClaims) return { ...question, claims: knownClaims.claims, claimsTruncated: knownClaims.truncated, complete: true };
	report?.({ stage: 'Listing the claims', fraction: 0 }, question);
	const { claims, truncated } = listClaims(d, limits.maxClaims, (fraction) => report?.({ stage: 'Listing the claims', fraction }, null));
	return { ...question, claims, claimsTruncated: truncated, complete: true };
}

/**
 * What the whole analysis depends on: ids, measured flags, arrows and the question. Labels,
 * notes, positions and the title do not matter, so moving or renaming a variable needs no
 * new analysis. O(n + m).
 */
export function analysisKey(d: Diagram): string {
	return JSON.stringify([claimsKey(d), d.exposures, d.outcomes, d.adjusted]);
}

/** What the claims depend on: ids, measured flags and arrows (not the question). O(n + m). */
export function claimsKey(d: Diagram): string {
	return JSON.stringify([d.variables.map((v) => (v.measured ? v.id : `!${v.id}`)), d.arrows.map((a) => [a.from, a.to])]);
}
