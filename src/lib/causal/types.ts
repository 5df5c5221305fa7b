/**
 * Result types of the causal engine, in terms of variable ids (strings), as the CLI prints
 * them and the app shows them. The index-based algorithms live beside this file; the façade
 * in analysis.ts converts.
 */

export type Effect = 'total' | 'direct';

/** Why a variable may not be in an adjustment set. */
export type ForbiddenWhy =
	| 'exposure'
	| 'outcome'
	| 'mediator'
	| 'descendant-of-mediator'
	| 'descendant-of-outcome'
	| 'descendant-of-exposure'
	| 'unmeasured';

export type AdjustmentProblem =
	| { kind: 'open-path'; path: string[] }
	| { kind: 'forbidden'; variable: string; why: ForbiddenWhy };

/**
 * A count of paths that may be capped: exact; more-than (over `count` exist: counting stops at
 * 10,000); at-least (the search's step budget ran out first).
 */
export interface PathCount {
	count: number;
	bound: 'exact' | 'more-than' | 'at-least';
}

export interface AdjustmentCheck {
	adjusted: string[];
	valid: boolean;
	/** Forbidden members, then the first open non-causal paths (at most `maxPaths`). */
	problems: AdjustmentProblem[];
	/** All open non-causal paths: the same count as the path listing's `openNonCausal`. */
	openPaths: PathCount;
}

export interface AdjustmentSets {
	exposures: string[];
	outcomes: string[];
	effect: Effect;
	identifiable: boolean;
	/** Each set sorted by id; sets ordered by size, then lexicographically. */
	sets: string[][];
	truncated: boolean;
	/** Efficiency-optimal set O (Henckel et al. 2022) when it exists and is all measured. */
	optimal: string[] | null;
	/** A minimum-size set (minimum vertex cut), null when not identifiable. */
	minimum: string[] | null;
	/**
	 * Why `optimal` is null (or empty because the exposure has no causal path to the outcome);
	 * absent when the optimal set exists along a causal path, or for the direct effect.
	 */
	optimalGap?: { why: 'no-causal-path' | 'not-identifiable' | 'not-valid' } | { why: 'unmeasured'; unmeasured: string[] };
}

export interface DSeparationResult {
	separated: boolean;
	/** One open path from a variable of `from` to one of `to`, when not separated. */
	path: string[] | null;
}

export type Role =
	| 'exposure'
	| 'outcome'
	| 'confounder'
	| 'common-cause'
	| 'mediator'
	| 'collider'
	| 'descendant-of-exposure'
	| 'descendant-of-outcome'
	| 'instrument-like'
	| 'precision'
	| 'unrelated';

export interface VariableRoles {
	id: string;
	roles: Role[];
	/**
	 * For a confounder: the rest of one minimal sufficient set that contains it (empty when it
	 * suffices alone) — what it must be adjusted together with, e.g. when it is also a collider.
	 */
	adjustWith?: string[];
	/**
	 * Set when the engine could not decide whether the variable is a confounder: the search
	 * for a minimal sufficient set containing it stopped at its budget on a large, dense
	 * diagram (confounders.ts). It is then not listed as a confounder, and says so.
	 */
	confounderUndecided?: true;
}

/** Why a path is blocked (first blocking node) or what keeps it open. */
export type PathNodeReason =
	| { node: string; reason: 'adjusted-non-collider' }
	| { node: string; reason: 'collider-not-adjusted' }
	| { node: string; reason: 'collider-adjusted' }
	| { node: string; reason: 'collider-descendant-adjusted'; via: string };

export interface PathInfo {
	nodes: string[];
	/** true for a directed path from exposure to outcome. */
	causal: boolean;
	open: boolean;
	/** When blocked: every node that blocks it. When open: each collider opened by adjustment. */
	reasons: PathNodeReason[];
}

export interface PathListing {
	paths: PathInfo[];
	truncated: boolean;
	/** All open non-causal paths under the planned set (listed first). */
	openNonCausal: PathCount;
}

export interface Claim {
	a: string;
	b: string;
	/** A minimal conditioning set of measured variables, or null when no measured set separates. */
	given: string[] | null;
}
