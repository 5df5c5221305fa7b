/**
 * The app's analysis in three parts, each recomputed only when what it depends on changes:
 *
 *  - verdict: the diagram's problems, the verdict on the planned set and the exposure–outcome
 *    paths under it. Depends on everything in `plannedKey`. In a worker it arrives in two
 *    steps: the verdict first (`analyseVerdictFirst`, milliseconds even at 1,000 variables),
 *    then the exact count of open non-causal paths and the listing (up to 10,000 paths counted:
 *    about 200 ms at 1,000 variables when there are that many), so a planned-set edit (the most
 *    common one) waits for nothing else;
 *  - sets: minimal sufficient sets (total and direct effect) and the roles. Depends on the
 *    structure, what is measured and the question, not on the planned set (`questionKey`):
 *    at 1,000 variables this was 85 % of each planned-set edit before the split;
 *  - claims: the implied independencies, O(n² (n + Σ indeg²)), depend on the structure and
 *    what is measured only (`structureKey`).
 *
 * The combined result equals the engine façade's `analyse` (tests/unit/workers/analysis-steps.test.ts).
 * Pure TypeScript: runs in the workers and, for small diagrams, on the main thread.
 */
import type { Diagram } from '../graph/diagram';
import type { DiagramIssue } from '../graph/validate';
import { validateDiagram } from '../graph/validate';
import {
	adjustmentSets,
	checkAndPaths,
	checkFirst,
	listImpliedClaims,
	variableRoles,
	type AdjustmentCheck,
	type AdjustmentSets,
	type Analysis,
	type Claim,
	type PathListing,
	type VariableRoles
} from '../causal';
import type { JobSteps } from './job-protocol';
import type { PartJob, PartProgress, PartResult } from './protocol';

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

export type AnalysisPart = 'verdict' | 'sets' | 'claims';

export interface VerdictPart {
	issues: DiagramIssue[];
	/** Acyclic, consistent, with an exposure and an outcome. */
	ready: boolean;
	check: AdjustmentCheck | null;
	/** Null while the paths are still being counted and listed (the check's count is then a lower bound). */
	paths: PathListing | null;
}

export interface SetsPart {
	sets: AdjustmentSets | null;
	directSets: AdjustmentSets | null;
	roles: VariableRoles[];
}

export interface ClaimsPart {
	claims: Claim[];
	truncated: boolean;
}

/** What `analyse` returns, with which parts are still being computed. */
export interface AppAnalysis extends Analysis {
	claimsTruncated: boolean;
	/** False while the claims are still being listed. */
	complete: boolean;
	/** True while the sets and roles for this diagram are still being computed. */
	setsPending: boolean;
	/** True while the open non-causal paths are being counted and listed (the verdict is final). */
	pathsPending: boolean;
}

/** The verdict part. O(n + m) plus the capped path listing. */
export function analyseVerdict(d: Diagram, limits: AnalysisLimits = DEFAULT_LIMITS, issues = validateDiagram(d, { needQuestion: true })): VerdictPart {
	if (issues.length > 0) return { issues, ready: false, check: null, paths: null };
	// One search for the open non-causal paths feeds the verdict and the Paths section.
	return { issues, ready: true, ...checkAndPaths(d, { maxPaths: limits.maxPaths }) };
}

/**
 * The verdict part's first step: the same problems and verdict, with the open non-causal paths
 * counted only up to the few listed as reasons (see `checkFirst`), and no path listing yet.
 */
export function analyseVerdictFirst(d: Diagram): VerdictPart {
	const issues = validateDiagram(d, { needQuestion: true });
	if (issues.length > 0) return { issues, ready: false, check: null, paths: null };
	return { issues, ready: true, check: checkFirst(d), paths: null };
}

/** The sets part (empty when the diagram is not ready for analysis). */
export function analyseSets(d: Diagram, limits: AnalysisLimits = DEFAULT_LIMITS): SetsPart {
	if (validateDiagram(d, { needQuestion: true }).length > 0) return { sets: null, directSets: null, roles: [] };
	const direct = d.exposures.length === 1 && d.outcomes.length === 1;
	return {
		sets: adjustmentSets(d, { max: limits.maxSets }),
		directSets: direct ? adjustmentSets(d, { effect: 'direct', max: limits.maxSets }) : null,
		roles: variableRoles(d)
	};
}

/**
 * The implied claims (one per non-adjacent pair of measured variables, in index order, as
 * `impliedClaims` lists them), calling `progress` with the fraction of pairs done about every
 * `every` pairs. Empty when the diagram is not a DAG.
 */
export function listClaims(d: Diagram, maxClaims: number, progress?: (fraction: number) => void, every = 250): ClaimsPart {
	return listImpliedClaims(d, { max: maxClaims, progress, every });
}

/**
 * Puts the parts together. A part computed for another diagram is left out (null, pending),
 * so that no section shows results that belong to an earlier state of the diagram.
 */
export function combine(verdict: VerdictPart, sets: SetsPart | null, claims: ClaimsPart | null): AppAnalysis {
	const ready = verdict.ready;
	return {
		issues: verdict.issues,
		ready,
		check: verdict.check,
		paths: verdict.paths,
		sets: ready ? (sets?.sets ?? null) : null,
		directSets: ready ? (sets?.directSets ?? null) : null,
		roles: ready ? (sets?.roles ?? []) : [],
		setsPending: ready && sets === null,
		pathsPending: ready && verdict.paths === null,
		claims: claims?.claims ?? [],
		claimsTruncated: claims?.truncated ?? false,
		complete: claims !== null
	};
}

/**
 * One part as a job step (job-runner.ts), in a worker or on the main thread. With `early`, the
 * verdict is sent first (`analyseVerdictFirst`) and the paths counted after it.
 */
export const analysisPartSteps: JobSteps<PartJob, PartProgress, PartResult> = ({ part, diagram, limits, early }, context) => {
	switch (part) {
		case 'verdict': {
			if (!early) return { part, value: analyseVerdict(diagram, limits) };
			const first = analyseVerdictFirst(diagram);
			context.partial({ kind: 'first', ms: context.elapsedMs(), value: first });
			return { part, value: first.ready ? analyseVerdict(diagram, limits, first.issues) : first };
		}
		case 'sets':
			return { part, value: analyseSets(diagram, limits) };
		case 'claims':
			return { part, value: listClaims(diagram, limits.maxClaims, (fraction) => context.progress({ kind: 'fraction', fraction })) };
	}
};

/** All three parts at once (small diagrams on the main thread, tests). */
export function runAnalysis(d: Diagram, limits: AnalysisLimits = DEFAULT_LIMITS): AppAnalysis {
	return combine(analyseVerdict(d, limits), analyseSets(d, limits), listClaims(d, limits.maxClaims));
}

/** What the claims depend on: ids, measured flags and arrows. O(n + m). */
export function structureKey(d: Diagram): string {
	return JSON.stringify([d.variables.map((v) => (v.measured ? v.id : `!${v.id}`)), d.arrows.map((a) => [a.from, a.to])]);
}

/** What the sets and roles depend on: the structure and the question, not the planned set. */
export function questionKey(d: Diagram, structure = structureKey(d)): string {
	return JSON.stringify([structure, d.exposures, d.outcomes]);
}

/**
 * What the whole analysis depends on. Labels, notes, positions and the title do not matter,
 * so moving or renaming a variable needs no new analysis. O(n + m).
 */
export function plannedKey(d: Diagram, question = questionKey(d)): string {
	return JSON.stringify([question, d.adjusted]);
}

/** The three keys of a diagram, each built on the last. */
export function analysisKeys(d: Diagram): Record<AnalysisPart, string> {
	const claims = structureKey(d);
	const sets = questionKey(d, claims);
	return { claims, sets, verdict: plannedKey(d, sets) };
}
