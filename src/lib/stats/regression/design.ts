/**
 * Model matrices for regression: an intercept, continuous covariates as they are, binary
 * covariates as 0/1, and categorical or ordinal covariates dummy-coded against their first
 * observed level (treatment coding; the reference is stated in the notes). Complete cases
 * over the outcome and all covariates. O(n·p) time and memory (row-major Float64Array,
 * one row of p numbers per case — the layout the IRLS loop streams through).
 */
import { StatsError } from '../errors';
import { completeRows, numericValues } from '../table/columns';
import type { CodedColumn, Column } from '../table/types';

export interface DesignTerm {
	/** Source column name ("(intercept)" for the intercept). */
	column: string;
	kind: Column['kind'] | 'intercept';
	/** Indices of this term's columns in the design. */
	indices: number[];
	/** Reference level of a dummy-coded term. */
	reference?: string;
}

export interface Design {
	/** Cases (rows) used. */
	n: number;
	/** Number of design columns, intercept included. */
	p: number;
	/** Row-major n × p. Column 0 is the intercept. */
	x: Float64Array;
	/** Outcome, when the design has one. */
	y: Float64Array | null;
	/** Coefficient names, one per design column. */
	names: string[];
	terms: DesignTerm[];
	/** Indices of the data rows used (complete cases). */
	rows: Int32Array;
	notes: string[];
}

export const INTERCEPT = '(intercept)';

/** Name of a binary column's single coefficient: the column name when its levels are 0/1. */
function binaryName(c: CodedColumn, levels: readonly string[]): string {
	return levels[0] === '0' && levels[1] === '1' ? c.name : `${c.name}[${levels[1]}]`;
}

/**
 * One design column as a vector of the table: the intercept, a numeric column's values, or
 * the 0/1 indicator of one level (a code of the column as read). Regressions on the same
 * rows that share vectors can share their cross-products (src/lib/stats/sufficient).
 */
export type DesignVector = { kind: 'one' } | { kind: 'values'; values: Float64Array } | { kind: 'level'; codes: Int32Array; level: number };

/** The outcome as numbers: a numeric column's values, or a coded column's codes (binary 0/1, ordinal scores). */
export type ResponseVector = { kind: 'values'; values: Float64Array } | { kind: 'codes'; codes: Int32Array };

/** A design before its n × p matrix is made: what buildDesign fills the matrix from. */
export interface DesignPlan {
	n: number;
	p: number;
	names: string[];
	terms: DesignTerm[];
	rows: Int32Array;
	notes: string[];
	vectors: DesignVector[];
	response: ResponseVector | null;
}

/**
 * The plan of the design for `outcome` (null for none) on `covariates` over the complete
 * cases (or the `rows` given, which must be those). O(n·k) for the observed levels.
 */
export function planDesign(outcome: Column | null, covariates: readonly Column[], rows?: Int32Array): DesignPlan {
	const all = outcome ? [outcome, ...covariates] : [...covariates];
	const names = new Set<string>();
	for (const c of all) {
		if (names.has(c.name)) throw new StatsError(`Column '${c.name}' appears twice in the model.`, { column: c.name });
		names.add(c.name);
	}
	const used = rows ?? completeRows(all);
	const notes: string[] = [];
	const terms: DesignTerm[] = [{ column: INTERCEPT, kind: 'intercept', indices: [0] }];
	const coefNames = [INTERCEPT];
	const vectors: DesignVector[] = [{ kind: 'one' }];
	for (const c of covariates) {
		if (c.kind === 'continuous') {
			terms.push({ column: c.name, kind: 'continuous', indices: [coefNames.length] });
			coefNames.push(c.name);
			vectors.push({ kind: 'values', values: c.values });
			continue;
		}
		const levels = observedCodes(c, used);
		if (levels.length < 2) {
			notes.push(`'${c.name}' has a single observed level ('${levels.length ? c.levels[levels[0]] : ''}') in the complete cases; it is left out.`);
			continue;
		}
		const labels = levels.map((l) => c.levels[l]);
		const indices: number[] = [];
		for (let l = 1; l < levels.length; l++) {
			indices.push(coefNames.length);
			coefNames.push(levels.length === 2 ? binaryName(c, labels) : `${c.name}[${labels[l]}]`);
			vectors.push({ kind: 'level', codes: c.codes, level: levels[l] });
		}
		terms.push({ column: c.name, kind: c.kind, indices, reference: labels[0] });
		if (levels.length > 2 || labels[0] !== '0') notes.push(`'${c.name}': dummy coding, reference level '${labels[0]}' (the first level).`);
	}
	const response: ResponseVector | null = outcome ? (outcome.kind === 'continuous' ? { kind: 'values', values: outcome.values } : { kind: 'codes', codes: outcome.codes }) : null;
	if (outcome && outcome.kind === 'categorical' && outcome.levels.length > 2) numericValues(outcome); // refused with its message
	return { n: used.length, p: coefNames.length, names: coefNames, terms, rows: used, notes, vectors, response };
}

/** The codes of a coded column that occur in the given rows, in level order. O(n). */
export function observedCodes(c: CodedColumn, rows: Int32Array): number[] {
	const seen = new Uint8Array(c.levels.length);
	const codes = c.codes;
	for (let k = 0; k < rows.length; k++) seen[codes[rows[k]]] = 1;
	const out: number[] = [];
	for (let l = 0; l < seen.length; l++) if (seen[l]) out.push(l);
	return out;
}

/** Value of a design vector at data row r. */
export function vectorAt(v: DesignVector, r: number): number {
	return v.kind === 'one' ? 1 : v.kind === 'values' ? v.values[r] : v.codes[r] === v.level ? 1 : 0;
}

/**
 * The row-major n × p matrix and outcome of a plan, filled one block of rows at a time (a
 * column at a time within the block, so each loop stays monomorphic and the block stays in
 * cache; filling whole columns of a million-row matrix touched every cache line p times).
 * O(n·p).
 */
export function materialize(plan: DesignPlan, buffer?: Float64Array): Design {
	const { n, p, rows, vectors } = plan;
	// A buffer given is reused (writing fresh memory costs a page fault per 4 KiB: ~70 % of
	// the time of a million-row design, measured).
	const x = buffer && buffer.length >= n * p ? buffer.subarray(0, n * p) : new Float64Array(n * p);
	const BLOCK = 1024;
	for (let start = 0; start < n; start += BLOCK) {
		const end = Math.min(n, start + BLOCK);
		for (let j = 0; j < p; j++) {
			const v = vectors[j];
			if (v.kind === 'one') for (let k = start; k < end; k++) x[k * p + j] = 1;
			else if (v.kind === 'values') {
				const values = v.values;
				for (let k = start; k < end; k++) x[k * p + j] = values[rows[k]];
			} else {
				const { codes, level } = v;
				for (let k = start; k < end; k++) x[k * p + j] = codes[rows[k]] === level ? 1 : 0;
			}
		}
	}
	let y: Float64Array | null = null;
	const response = plan.response;
	if (response) {
		y = new Float64Array(n);
		if (response.kind === 'values') for (let k = 0; k < n; k++) y[k] = response.values[rows[k]];
		else for (let k = 0; k < n; k++) y[k] = response.codes[rows[k]];
	}
	return { n, p, x, y, names: plan.names, terms: plan.terms, rows, notes: plan.notes };
}

/**
 * Build the design for `outcome` (null for none) on `covariates`. The outcome is read as
 * numbers (continuous values, binary 0/1, ordinal scores).
 */
export function buildDesign(outcome: Column | null, covariates: readonly Column[]): Design {
	return materialize(planDesign(outcome, covariates));
}

/** A design from plain arrays (all predictors numeric), with an intercept. O(n·p). */
export function designFromArrays(y: Float64Array | null, predictors: readonly { name: string; values: Float64Array }[]): Design {
	const n = y ? y.length : (predictors[0]?.values.length ?? 0);
	const p = predictors.length + 1;
	const x = new Float64Array(n * p);
	for (let k = 0; k < n; k++) {
		x[k * p] = 1;
		for (let j = 1; j < p; j++) x[k * p + j] = predictors[j - 1].values[k];
	}
	const rows = new Int32Array(n);
	for (let k = 0; k < n; k++) rows[k] = k;
	return {
		n,
		p,
		x,
		y,
		names: [INTERCEPT, ...predictors.map((q) => q.name)],
		terms: [{ column: INTERCEPT, kind: 'intercept', indices: [0] }, ...predictors.map((q, j) => ({ column: q.name, kind: 'continuous' as const, indices: [j + 1] }))],
		rows,
		notes: []
	};
}
